/** POST /api/sets/:id/reanalyze: queue a re-measurement of every strike of the set with the current engine (202, poll statusUrl). */
export default defineEventHandler(event => reanalyzeFromRoute(event, 'set'))
