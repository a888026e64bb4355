import type { Executor } from '../database/client'
import { seedStarterTemplates } from './templates'

/** What every new workshop starts with: the starter ratio-template library. */
export async function seedNewWorkshop(tx: Executor, workshopId: string, userId: string): Promise<void> {
  await seedStarterTemplates(tx, workshopId, userId)
}
