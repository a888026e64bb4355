import { and, asc, count, eq, sql } from 'drizzle-orm'
import { pieces, sets, users } from '../database/schema'
import type { Executor } from '../database/client'

/** The sets and benchmakers (assignees) that have pieces waiting for review, with how many each. */
export async function reviewFilters(db: Executor, workshopId: string) {
  const waiting = and(eq(pieces.workshopId, workshopId), eq(pieces.stage, 'review'))
  const [setRows, benchmakerRows] = await Promise.all([
    db.select({ id: sets.id, name: sets.name, serial: sets.serial, count: count() }).from(pieces)
      .innerJoin(sets, eq(sets.id, pieces.setId)).where(waiting)
      .groupBy(sets.id, sets.name, sets.serial).orderBy(asc(sets.name)),
    db.select({ id: pieces.assigneeId, name: users.name, count: count() }).from(pieces)
      .leftJoin(users, eq(users.id, pieces.assigneeId)).where(waiting)
      .groupBy(pieces.assigneeId, users.name).orderBy(sql`${users.name} asc nulls last`),
  ])
  return {
    sets: setRows,
    benchmakers: benchmakerRows.map(b => ({ id: b.id ?? 'none', name: b.name ?? 'Unassigned', count: b.count })),
  }
}
