// `node scripts/lib/watchdog.mjs <pid>` — started with an IPC channel by the process that started mariadbd (which
// cannot watch its parent itself). When the channel closes because that process died, however it died, the
// watchdog stops mariadbd: SIGTERM (a clean InnoDB shutdown), then SIGKILL if it is still there after 60 s.
// It exits by itself when mariadbd is gone. Node built-ins only.
import fs from "node:fs";

const pid = Number(process.argv[2]);
if (!Number.isInteger(pid) || pid <= 1) process.exit(2);

/** Alive and not a zombie (a stopped mariadbd can stay a zombie for a moment: read /proc, not only kill -0). */
function alive() {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
    const state = stat.slice(stat.lastIndexOf(")") + 2, stat.lastIndexOf(")") + 3);
    return state !== "Z" && state !== "X";
  } catch {
    return false;
  }
}
const isMariadb = () => {
  try {
    return fs.readFileSync(`/proc/${pid}/cmdline`, "utf8").includes("mariadbd");
  } catch {
    return false;
  }
};

// Ctrl-C reaches the whole process group; the parent does the orderly stop, so the watchdog ignores SIGINT.
process.on("SIGINT", () => {});
process.on("SIGTERM", () => process.exit(0));

const poll = setInterval(() => {
  if (!alive()) process.exit(0);
}, 2000);

process.once("disconnect", () => {
  clearInterval(poll);
  if (!alive() || !isMariadb()) process.exit(0);
  try { process.kill(pid, "SIGTERM"); } catch { process.exit(0); }
  const until = Date.now() + 60000;
  const wait = setInterval(() => {
    if (!alive()) process.exit(0);
    if (Date.now() > until) {
      try { process.kill(pid, "SIGKILL"); } catch { /* gone */ }
      process.exit(0);
    }
  }, 200);
  void wait;
});
if (!process.channel) process.exit(2);
