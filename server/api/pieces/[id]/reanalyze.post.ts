/** POST /api/pieces/:id/reanalyze: queue a re-measurement of the piece's strikes with the current engine (202, poll statusUrl). */
export default defineEventHandler(event => reanalyzeFromRoute(event, 'piece'))
