import { sql } from 'drizzle-orm'
import { pieces } from '../database/schema'

/**
 * True while a piece's approval can still be undone, by the database's clock (so every
 * app instance agrees, and no timer is held anywhere). Null or past: final.
 */
export const approvalPending = () => sql<boolean>`coalesce(${pieces.approvalFinalAt} > now(), false)`
