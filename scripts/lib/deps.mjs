// Installs what the project needs: npm packages, and Debian packages (MariaDB, Chromium) as root.
import fs from "node:fs";
import path from "node:path";
import { ROOT, capture, fail, isRoot, log, run } from "./env.mjs";

/** `npm ci` when node_modules is missing or older than package-lock.json. */
export function ensureNodeModules() {
  const lock = path.join(ROOT, "package-lock.json");
  const marker = path.join(ROOT, "node_modules", ".package-lock.json");
  const stale = !fs.existsSync(marker) || fs.statSync(marker).mtimeMs < fs.statSync(lock).mtimeMs;
  if (!stale) return;
  log("installing npm packages (npm ci)…");
  run("npm", ["ci", "--no-audit", "--no-fund"]);
  // npm ci may leave the marker older than the lock (it copies the lock's timestamp); touch it.
  const now = new Date();
  fs.utimesSync(marker, now, now);
}

function debInstalled(pkg) {
  const res = capture("dpkg-query", ["-W", "-f=${Status}", pkg]);
  return res.status === 0 && res.stdout.includes("install ok installed");
}

let aptUpdated = false;
/** Install Debian packages that are missing (as root), or stop with what to install. */
export function ensureDebPackages(packages) {
  const missing = packages.filter((p) => !debInstalled(p));
  if (missing.length === 0) return;
  if (!isRoot()) {
    fail(`missing Debian packages: ${missing.join(", ")}. Install them with: sudo apt-get install -y ${missing.join(" ")}`);
  }
  log(`installing ${missing.join(", ")} with apt-get…`);
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  if (!aptUpdated) {
    run("apt-get", ["update"], { env });
    aptUpdated = true;
  }
  run("apt-get", ["install", "-y", "--no-install-recommends", ...missing], { env });
}
