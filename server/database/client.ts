import { drizzle } from 'drizzle-orm/postgres-js'
import postgres from 'postgres'
import * as schema from './schema'

/** A Drizzle database over postgres.js; used by the server and by the scripts. */
export function createDatabase(url: string, options: { max?: number } = {}) {
  const client = postgres(url, {
    max: options.max ?? 10,
    idle_timeout: 30,
    connect_timeout: 5,
    onnotice: () => {},
  })
  const db = drizzle(client, { schema })
  return { db, client }
}

export type Database = ReturnType<typeof createDatabase>['db']
/** An open transaction. */
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0]
/** A database or an open transaction: services accept either. */
export type Executor = Database | Transaction
/** What a service that opens its own transaction needs: the database, or a transaction (in which it nests as a savepoint). */
export type Transactor = Pick<Transaction, 'transaction'>
