// Builds the web app with `expo export` only when its sources changed since the last build.
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { ROOT, DATA, fail, log, runAsync } from "./env.mjs";

const SOURCES = ["app", "components", "shared", "assets", "app.json", "babel.config.js", "package-lock.json", "tsconfig.json"];

function hashSources() {
  const h = crypto.createHash("sha256");
  const visit = (rel) => {
    const abs = path.join(ROOT, rel);
    if (!fs.existsSync(abs)) return;
    const st = fs.statSync(abs);
    if (st.isDirectory()) {
      for (const name of fs.readdirSync(abs).sort()) visit(path.join(rel, name));
    } else {
      h.update(rel).update("\0").update(fs.readFileSync(abs)).update("\0");
    }
  };
  SOURCES.forEach(visit);
  return h.digest("hex");
}

export function webDist() {
  return process.env.WEB_DIST ? path.resolve(process.env.WEB_DIST) : path.join(ROOT, "dist");
}

/** Returns true when it built. A lock keeps two Panwise commands from exporting into one folder at once. */
export async function ensureWebBuild({ force = false } = {}) {
  const dist = webDist();
  const stamp = path.join(dist, ".panwise-build-hash");
  const hash = hashSources();
  if (!force && fs.existsSync(path.join(dist, "index.html")) && fs.existsSync(stamp) && fs.readFileSync(stamp, "utf8") === hash) return false;
  fs.mkdirSync(DATA, { recursive: true });
  const lock = path.join(DATA, "web-build.lock");
  const until = Date.now() + 5 * 60 * 1000;
  for (;;) {
    try {
      fs.writeFileSync(lock, String(process.pid), { flag: "wx" });
      break;
    } catch {
      const holder = Number(fs.readFileSync(lock, "utf8"));
      let alive = false;
      try { process.kill(holder, 0); alive = true; } catch { /* gone */ }
      if (!alive) { fs.rmSync(lock, { force: true }); continue; }
      if (Date.now() > until) fail("another web build has held .data/web-build.lock for 5 minutes");
      await new Promise((r) => setTimeout(r, 500));
    }
  }
  try {
    if (!force && fs.existsSync(stamp) && fs.readFileSync(stamp, "utf8") === hash) return false; // built by the other one
    log("building the web app (expo export)…");
    const started = Date.now();
    // Not spawnSync: the calling command keeps handling Ctrl-C and SIGTERM while the export runs (and ends it).
    const res = await runAsync("npx", ["expo", "export", "--platform", "web", "--output-dir", dist], {
      env: { ...process.env, EXPO_OFFLINE: "1", EXPO_NO_TELEMETRY: "1", CI: "1" },
    });
    if (res.status !== 0) fail(`expo export exited with ${res.status ?? res.signal}`);
    fs.writeFileSync(stamp, hash);
    log(`web app built in ${Math.round((Date.now() - started) / 1000)} s`);
    return true;
  } finally {
    fs.rmSync(lock, { force: true });
  }
}
