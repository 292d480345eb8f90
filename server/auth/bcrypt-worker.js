// Runs inside a worker thread (piscina): bcryptjs is pure JavaScript, so comparing a bcrypt-era hash on the
// main thread would block every other request for the whole comparison (its async API only yields between
// rounds, it still runs on the main thread — bcryptjs README, "Usage - Async").
// Plain CommonJS on purpose: a worker thread loads this file with Node alone, without the TypeScript loader.
"use strict";
const bcrypt = require("bcryptjs");

/** @param {{ password: string, hash: string }} task */
module.exports = function compare(task) {
  return bcrypt.compareSync(task.password, task.hash);
};
