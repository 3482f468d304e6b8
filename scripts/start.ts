/** `npm start`: make sure the web build is fresh, then run the server (migrations, demo seed, fake mail, HTTP). */
import { ensureWebBuild } from './web-build';

ensureWebBuild();
// Loaded only after the build is fresh (an import would start the server first).
// eslint-disable-next-line @typescript-eslint/no-require-imports
require('../server/index');
