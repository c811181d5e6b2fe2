// Seeds the invented demo scenario; running it again changes nothing.
import { initDataSource } from '../server/db/dataSource';
import { seedDemo } from '../server/services/seedDemo';

const ds = await initDataSource();
const { created } = await seedDemo(ds);
console.log(`[seed] demo scenario ${created ? `seeded (${created} rows)` : 'already present'}`);
await ds.destroy();
