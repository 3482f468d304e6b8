// Entry of a sheet worker thread. Worker threads start as plain Node, without the TypeScript loader
// of the process that spawned them (tsx under `npm start`, ts-jest under Jest), so this file
// registers tsx itself and then loads the TypeScript tasks.
require('tsx/cjs/api').register();
module.exports = require('./sheet-tasks.ts');
