import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { loadConfig } from '../../../server/config'

describe('loadConfig', () => {
  it('reads every path setting from the environment it is given, not from process.env', () => {
    const config = loadConfig({
      HOLDFAST_DATA_DIR: '/srv/yard',
      HOLDFAST_DB_TEMPLATE: '/opt/holdfast/db-template.tar.gz',
      HOLDFAST_MIGRATIONS: '/opt/holdfast/migrations',
      HOLDFAST_CLIENT_DIR: '/opt/holdfast/client',
    })
    expect(config.database).toEqual({ kind: 'pglite', dataDir: '/srv/yard', template: '/opt/holdfast/db-template.tar.gz' })
    expect(config.migrationsFolder).toBe('/opt/holdfast/migrations')
    expect(config.clientDir).toBe('/opt/holdfast/client')
    expect(config.filesDir).toBe('/srv/yard/files')
  })

  it('defaults the paths to the project layout, resolved from the working directory', () => {
    const config = loadConfig({})
    expect(config.migrationsFolder).toBe(path.resolve('db/migrations'))
    expect(config.clientDir).toBe(path.resolve('dist/client'))
    expect(config.database).toEqual({ kind: 'pglite', dataDir: path.resolve('data'), template: path.resolve('dist/db-template.tar.gz') })
  })

  it('refuses to start on a setting it cannot use, naming each one', () => {
    expect(() => loadConfig({ PORT: 'eighty', HOLDFAST_MIGRATIONS: '' })).toThrow(/PORT[\s\S]*HOLDFAST_MIGRATIONS|HOLDFAST_MIGRATIONS[\s\S]*PORT/)
  })
})
