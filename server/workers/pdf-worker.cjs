// Entry of a PDF plan worker thread: registers the TypeScript loader (worker threads do not inherit
// it, see sheet-worker.cjs) and loads the task.
require('tsx/cjs/api').register();
module.exports = require('./pdf-tasks.ts');
