import type { Executor } from '../database/client'

/**
 * What every new workshop starts with. The starter ratio-template library is
 * added here by the records part of the product.
 */
export async function seedNewWorkshop(_tx: Executor, _workshopId: string, _userId: string): Promise<void> {}
