// `npm run -s apikey -- <id>`: a new API key for the caller <id>, printed once as one JSON line
// {"id","key","entry"}. Give `key` to the caller; add `entry` (the salted scrypt hash) to API_KEYS.
// From the built image: `node dist/src/auth/apikey-cli.js <id>`.
import { newKey } from './keys.js';

const id = process.argv[2];
if (id === undefined || process.argv.length > 3) {
  console.error('usage: npm run -s apikey -- <id>   (id: 1-64 letters, digits, _ or -)');
  process.exit(2);
}
try {
  console.log(JSON.stringify(await newKey(id)));
} catch (error) {
  console.error((error as Error).message);
  process.exit(2);
}
