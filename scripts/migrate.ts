// Applies pending TypeORM migrations to the database named by PG* variables.
import { initDataSource } from '../server/db/dataSource';

const ds = await initDataSource();
const applied = await ds.runMigrations({ transaction: 'each' });
console.log(`[migrate] ${applied.length ? applied.map((m) => m.name).join(', ') : 'database is up to date'}`);
await ds.destroy();
