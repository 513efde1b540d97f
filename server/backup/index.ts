export { BACKUP_FORMAT, companyCheckpoints, makeBackup, readManifest, restoreBackup, tableNames, tableStats } from './backup'
export type { CompanyCheckpoint, Manifest, RestoreReport, TableStat } from './backup'
