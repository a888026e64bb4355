// Class: nothing is half-saved or left dangling — the app connects to PostgreSQL as a
// role that owns its schema but is not a superuser (scripts/lib-postgres.sh: ensure_app_role).
import { afterAll, describe, expect, it } from 'vitest'
import { testSql } from '../support/mail'

afterAll(async () => {
  await testSql().end()
})

describe('database role (class: the app is not a superuser)', () => {
  it('the URL the app and the tests are given logs in as a role without superuser, role or database rights', async () => {
    const [me] = await testSql()`select current_user as name, rolsuper, rolcreaterole, rolcreatedb, rolbypassrls from pg_roles where rolname = current_user`
    expect(me!.name).toBe('tonewright_app')
    expect(me).toMatchObject({ rolsuper: false, rolcreaterole: false, rolcreatedb: false, rolbypassrls: false })
    await expect(testSql()`create role tonewright_intruder login superuser`).rejects.toThrow(/permission denied|must be superuser/i)
  })

  it('every session of the running app (web requests and the pg-boss worker) is that role', async () => {
    const sessions = await testSql()`select a.usename, a.application_name, r.rolsuper from pg_stat_activity a join pg_roles r on r.oid = a.usesysid where a.datname = current_database()`
    expect(sessions.some(s => s.application_name === 'tonewright-jobs')).toBe(true)
    for (const s of sessions) expect({ user: s.usename, super: s.rolsuper }).toEqual({ user: 'tonewright_app', super: false })
  })

  it('the role owns the database, its schemas (also the one pg-boss made at start) and every table in them', async () => {
    const [db] = await testSql()`select pg_get_userbyid(datdba) as owner from pg_database where datname = current_database()`
    expect(db!.owner).toBe('tonewright_app')
    const schemas = await testSql()`select nspname, pg_get_userbyid(nspowner) as owner from pg_namespace where nspname in ('drizzle', 'pgboss')`
    expect(schemas.map(s => `${s.nspname}:${s.owner}`).sort()).toEqual(['drizzle:tonewright_app', 'pgboss:tonewright_app'])
    const others = await testSql()`select c.relname, pg_get_userbyid(c.relowner) as owner from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where n.nspname in ('public', 'drizzle', 'pgboss') and c.relkind in ('r', 'p', 'S') and pg_get_userbyid(c.relowner) <> 'tonewright_app'`
    expect(others).toEqual([])
    const [tables] = await testSql()`select count(*)::int as n from pg_tables where schemaname = 'public'`
    expect(tables!.n).toBeGreaterThan(10)
  })
})
