/** `npm start`: make sure the web build is fresh, then run the server (migrations, demo seed, fake mail, HTTP). */
import { ensureWebBuild } from './web-build';

ensureWebBuild();
require('../server/index');
