// Preloaded into the Node children `npm start` runs (`node --import ./scripts/lib/parent-watch.mjs …`), which it
// spawns with an IPC channel. When that channel closes — the parent exited, crashed or was SIGKILLed — the child
// sends itself SIGTERM, so its own clean shutdown runs, and exits anyway 15 s later.
// Node docs, child_process: "The 'disconnect' event is emitted … when the parent process … exits";
// process.channel.unref() keeps the channel from holding the event loop open.
if (process.channel) {
  process.channel.unref();
  process.once("disconnect", () => {
    process.kill(process.pid, "SIGTERM");
    setTimeout(() => process.exit(1), 15000).unref();
  });
}
