// Worker threads do not inherit tsx's loader: register it, then load the
// TypeScript task table. Piscina calls the exported function per task.
require('tsx/cjs');
module.exports = require('./tasks.ts').runTask;
