// Creates an administrator account on a server without the demo scenario:
//   npm run create-admin -- --email you@example.org --name "Your Name"
// The password is read from standard input (typed or piped), never from the command line.
import { createInterface } from 'node:readline/promises';
import { parseArgs } from 'node:util';
import { createUserBody } from '../shared/schemas/accounts';
import { initDataSource } from '../server/db/dataSource';
import { HttpError } from '../server/http/errors';
import { createUser } from '../server/services/users';

const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' } } });
const rl = createInterface({ input: process.stdin, output: process.stderr, terminal: false });
if (process.stdin.isTTY) process.stderr.write('Password for the new administrator: ');
const password = ((await rl.question('')) ?? '').trim();
rl.close();

const body = createUserBody.safeParse({ email: values.email, name: values.name, password, globalRole: 'admin' });
if (!body.success) {
  for (const i of body.error.issues) console.error(`[create-admin] ${i.path.join('.') || 'input'}: ${i.message}`);
  process.exit(2);
}
const ds = await initDataSource();
try {
  const user = await createUser(null, body.data);
  console.log(`[create-admin] administrator ${user.email} created`);
} catch (err) {
  if (!(err instanceof HttpError)) throw err;
  console.error(`[create-admin] ${err.message}`);
  for (const i of err.issues ?? []) console.error(`[create-admin] ${i.path}: ${i.message}`);
  process.exitCode = 2;
} finally {
  await ds.destroy();
}
