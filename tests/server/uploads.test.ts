import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import zlib from "node:zlib";
import PDFDocument from "pdfkit";
import sharp from "sharp";
import { startTestApp, makeAccount, makeBakery, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { ROOT_DIR } from "../../server/config";

/**
 * Uploads in the default data-directory layout: the store lives under a dot-directory (`.data/uploads`), which
 * Express's res.sendFile refuses (send's dotfiles rule); every stored photo and certificate answered 500 there.
 * Issue 8 items 4 (serving) and 11 (quotas, expiry range, polyglots).
 */

// 22:00 in Chicago on Wed 10 June 2026, already 11 June in UTC: "today" for expiry dates is the bakery's 10 June.
const NOW = "2026-06-11T03:00:00Z";
const TODAY = "2026-06-10";
let t: TestApp;
let tmp: string;
let owner: string;
let baker: string;
let buyer: string;
let otherBuyer: string;
let accountId: number;
let productId: number;

/** The configured uploads directory as loadConfig builds it from PANWISE_DATA_DIR, read in a fresh module registry. */
function uploadsDirFor(env: Record<string, string | undefined>): string {
  const saved = Object.fromEntries(Object.keys(env).map((k) => [k, process.env[k]]));
  let dir = "";
  try {
    for (const [k, v] of Object.entries(env)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
    jest.isolateModules(() => {
      dir = (require("../../server/config") as typeof import("../../server/config")).loadConfig().uploadsDir;
    });
  } finally {
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  }
  return dir;
}

beforeAll(async () => {
  tmp = fs.mkdtempSync(path.join(os.tmpdir(), "panwise-uploads-"));
  t = await startTestApp({ now: NOW });
  // The default layout: a data directory called .data, as `npm start` uses it.
  t.ctx.config.uploadsDir = uploadsDirFor({ PANWISE_DATA_DIR: path.join(tmp, ".data"), JWT_SECRET: "x".repeat(48) });
  await makeBakery(t.ds, { timeZone: "America/Chicago" });
  accountId = (await makeAccount(t.ds, { businessName: "Upload Café" })).id;
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  baker = await tokenFor(t, await makeUser(t.ds, "baker"));
  buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId }));
  otherBuyer = await tokenFor(t, await makeUser(t.ds, "buyer"));
  const created = await t.http().post("/api/products").set(auth(owner)).send({
    name: "Milk bread rolls", description: "", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", piecesPerUnit: 15, pieceGrams: 67,
    panName: "9×13 in pan", panLengthMm: 330, panWidthMm: 229, unitsPerPan: 1, priceCents: 1800, minQuantity: 1, maxQuantity: 40, allergens: ["gluten", "wheat", "milk"], mayContain: "",
    boughtIn: true, // an active product needs a formula or the explicit "bought in" choice
  });
  productId = created.body.product.id;
});
afterAll(async () => {
  await t.close();
  fs.rmSync(tmp, { recursive: true, force: true });
});

// ---- fixtures, built from their specifications --------------------------------------------------------------

/** A real PNG (PNG spec, ISO/IEC 15948: signature, IHDR, IDAT, IEND, CRC-32 from zlib), w×1 pixels. */
function png(width = 1): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4); len.writeUInt32BE(data.length);
    const td = Buffer.concat([Buffer.from(type), data]);
    const crc = Buffer.alloc(4); crc.writeUInt32BE(zlib.crc32(td) >>> 0);
    return Buffer.concat([len, td, crc]);
  };
  const ihdr = Buffer.alloc(13); ihdr.writeUInt32BE(width, 0); ihdr.writeUInt32BE(1, 4); ihdr[8] = 8; ihdr[9] = 2; // 8-bit RGB
  const row = Buffer.concat([Buffer.from([0]), Buffer.alloc(width * 3, 0x80)]);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", zlib.deflateSync(row)), chunk("IEND", Buffer.alloc(0))]);
}
const IEND = Buffer.from([0x00, 0x00, 0x00, 0x00, 0x49, 0x45, 0x4e, 0x44, 0xae, 0x42, 0x60, 0x82]); // IEND with its fixed CRC
const HTML_TAIL = Buffer.from("<html><body><script>fetch('/api/auth/me').then(r=>r.text()).then(alert)</script></body></html>");

/** A real PDF written by pdfkit (it ends with the trailer: startxref, offset, %%EOF). `padTo` pads with a comment line. */
async function pdf(text: string, padTo = 0): Promise<Buffer> {
  const doc = new PDFDocument({ size: "LETTER" });
  const parts: Buffer[] = [];
  doc.on("data", (c: Buffer) => parts.push(c));
  const done = new Promise<Buffer>((r) => doc.on("end", () => r(Buffer.concat(parts))));
  doc.text(text);
  doc.end();
  const bytes = await done;
  if (bytes.length >= padTo) return bytes;
  const nl = bytes.indexOf(0x0a) + 1; // after the %PDF-1.x header line: a comment line (ISO 32000-1 §7.2.4)
  return Buffer.concat([bytes.subarray(0, nl), Buffer.from("%"), Buffer.alloc(padTo - bytes.length - 2, "p"), Buffer.from("\n"), bytes.subarray(nl)]);
}

const certificate = (token: string, acct: number, file: Buffer, expiresOn: string, filename = "certificate.pdf") =>
  t.http().post(`/api/accounts/${acct}/certificates`).set(auth(token)).field("expiresOn", expiresOn).attach("file", file, { filename });

const storedFiles = (sub = "") => {
  const dir = path.join(t.ctx.config.uploadsDir, sub);
  return fs.existsSync(dir) ? fs.readdirSync(dir).filter((f) => !fs.statSync(path.join(dir, f)).isDirectory()).sort() : [];
};

// ---- item 4: serving stored files -----------------------------------------------------------------------------

describe("stored files are served from the default data directory (a dot-directory)", () => {
  it("the default data directory is .data in the project, and uploads live under it", () => {
    expect(uploadsDirFor({ PANWISE_DATA_DIR: undefined, JWT_SECRET: "x".repeat(48) })).toBe(path.join(ROOT_DIR, ".data", "uploads"));
    expect(t.ctx.config.uploadsDir).toBe(path.join(tmp, ".data", "uploads"));
    expect(t.ctx.config.uploadsDir.split(path.sep)).toContain(".data");
  });

  it("a product photo uploads and downloads with its type, nosniff and a year's immutable cache; a repeat fetch is 304", async () => {
    const up = await t.http().put(`/api/products/${productId}/photo`).set(auth(owner)).attach("photo", png(3), { filename: "rolls.png" });
    expect(up.status).toBe(200);
    const url: string = up.body.product.photoUrl;
    expect(url).toMatch(/^\/api\/uploads\/[a-f0-9]{64}\.webp$/);
    expect(fs.existsSync(path.join(t.ctx.config.uploadsDir, path.basename(url)))).toBe(true);
    const img = await t.http().get(url).buffer(true);
    expect(img.status).toBe(200);
    expect(img.headers["content-type"]).toBe("image/webp");
    expect(img.headers["x-content-type-options"]).toBe("nosniff");
    // RFC 9111 §5.2.2.1 max-age, RFC 8246 immutable: the name is the content hash, it never changes meaning.
    expect(img.headers["cache-control"]).toBe("public, max-age=31536000, immutable");
    expect(img.headers["content-disposition"]).toBeUndefined();
    const meta = await sharp(img.body as Buffer).metadata();
    expect(meta).toMatchObject({ format: "webp", width: 3, height: 1 }); // never enlarged
    const again = await t.http().get(url).set("If-None-Match", img.headers.etag);
    expect(again.status).toBe(304); // RFC 9110 §13.1.2
  });

  it("a tax certificate uploads and downloads as an attachment, never cached, with its type and nosniff", async () => {
    const bytes = await pdf("Resale certificate — Upload Café");
    const up = await certificate(buyer, accountId, bytes, "2027-06-30");
    expect(up.status).toBe(201);
    const id = up.body.certificate.id;
    for (const token of [buyer, owner]) {
      const file = await t.http().get(`/api/certificates/${id}/file`).set(auth(token)).buffer(true).parse((res, cb) => {
        const parts: Buffer[] = [];
        res.on("data", (c: Buffer) => parts.push(c));
        res.on("end", () => cb(null, Buffer.concat(parts)));
      });
      expect(file.status).toBe(200);
      expect(file.headers["content-type"]).toBe("application/pdf");
      expect(file.headers["x-content-type-options"]).toBe("nosniff");
      expect(file.headers["content-disposition"]).toBe(`attachment; filename="certificate-${id}.pdf"`);
      expect(file.headers["cache-control"]).toBe("private, no-store");
      expect(Buffer.compare(file.body as Buffer, bytes)).toBe(0);
    }
    // Another account's buyer gets 404 (not 403), as JSON.
    const other = await t.http().get(`/api/certificates/${id}/file`).set(auth(otherBuyer));
    expect(other.status).toBe(404);
    expect(other.headers["content-type"]).toMatch(/^application\/json/);
  });

  it("a stored file gone from the disk is a 404 in JSON, never a 500 and never sent as the file's type", async () => {
    const up = await certificate(owner, accountId, await pdf("A certificate whose file goes missing"), "2027-01-31");
    expect(up.status).toBe(201);
    const product = await t.http().put(`/api/products/${productId}/photo`).set(auth(owner)).attach("photo", png(5), { filename: "gone.png" });
    const photoUrl: string = product.body.product.photoUrl;
    const [row] = await t.ds.query("SELECT file FROM tax_certificate WHERE id = ?", [up.body.certificate.id]);
    fs.rmSync(path.join(t.ctx.config.uploadsDir, "certificates", row.file));
    fs.rmSync(path.join(t.ctx.config.uploadsDir, path.basename(photoUrl)));
    for (const res of [await t.http().get(`/api/certificates/${up.body.certificate.id}/file`).set(auth(owner)), await t.http().get(photoUrl)]) {
      expect(res.status).toBe(404);
      expect(res.headers["content-type"]).toBe("application/json; charset=utf-8");
      expect(res.headers["content-disposition"]).toBeUndefined();
      expect(res.body.error).toMatchObject({ code: "not_found", message: expect.any(String) });
    }
  });

  it("only stored ids are served: no path traversal, no other names", async () => {
    fs.mkdirSync(path.join(tmp, ".data"), { recursive: true });
    fs.writeFileSync(path.join(tmp, ".data", "jwt-secret"), "secret");
    for (const name of ["..%2Fjwt-secret", "%2e%2e%2fjwt-secret", "..%5Cjwt-secret", `${"a".repeat(64)}.html`, `${"A".repeat(64)}.png`, "certificates", ".incoming-0123", `${"a".repeat(63)}.png`]) {
      const res = await t.http().get(`/api/uploads/${name}`);
      expect([400, 404]).toContain(res.status);
      expect(res.headers["content-type"]).toMatch(/^application\/json/);
      expect(res.text).not.toBe("secret");
    }
  });
});

// ---- item 11: quotas, expiry range, polyglots ------------------------------------------------------------------

describe("photo sizes (issue 12, item 1)", () => {
  it("a 1600×1200 phone photo with a GPS position becomes a 640 px and a 160 px WebP without metadata; the original stays private", async () => {
    // A camera-like JPEG: EXIF with a GPS block (EXIF 2.32 §4.6.6, GPS Info IFD), 4:3 like a phone's sensor.
    const photo = await sharp({ create: { width: 1600, height: 1200, channels: 3, background: "#d9a566" } })
      .jpeg({ quality: 90 })
      .withExif({ IFD0: { Make: "Phone", Model: "Camera" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "41/1 52/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "87/1 37/1 0/1" } })
      .toBuffer();
    expect((await sharp(photo).metadata()).exif).toBeDefined(); // the test photo really carries metadata
    const up = await t.http().put(`/api/products/${productId}/photo`).set(auth(owner)).attach("photo", photo, { filename: "IMG_0001.jpg" });
    expect(up.status).toBe(200);
    const { photoUrl, photoThumbUrl } = up.body.product as { photoUrl: string; photoThumbUrl: string };
    expect(photoUrl).not.toBe(photoThumbUrl);
    for (const [url, width, height] of [[photoUrl, 640, 480], [photoThumbUrl, 160, 120]] as const) {
      const res = await t.http().get(url).buffer(true);
      expect(res.status).toBe(200);
      expect(res.headers["content-type"]).toBe("image/webp");
      expect(res.headers["cache-control"]).toBe("public, max-age=31536000, immutable");
      const meta = await sharp(res.body as Buffer).metadata();
      expect(meta).toMatchObject({ format: "webp", width, height }); // the aspect ratio is kept
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.icc).toBeUndefined();
    }
    // The buyer's catalog carries both sizes.
    const list = await t.http().get("/api/products").set(auth(buyer));
    expect(list.body.products.find((p: { id: number }) => p.id === productId)).toMatchObject({ photoUrl, photoThumbUrl });
    // The original is kept (for other sizes later), re-encoded without metadata, and no URL reaches it.
    const [row] = await t.ds.query("SELECT photoOriginalFile FROM product WHERE id = ?", [productId]);
    expect(row.photoOriginalFile).toMatch(/^[a-f0-9]{64}\.jpg$/);
    const original = fs.readFileSync(path.join(t.ctx.config.uploadsDir, "originals", row.photoOriginalFile));
    const originalMeta = await sharp(original).metadata();
    expect(originalMeta).toMatchObject({ format: "jpeg", width: 1600, height: 1200 });
    expect(originalMeta.exif).toBeUndefined();
    for (const url of [`/api/uploads/${row.photoOriginalFile}`, `/api/uploads/originals/${row.photoOriginalFile}`, `/api/uploads/originals%2F${row.photoOriginalFile}`]) {
      expect((await t.http().get(url)).status).toBe(404);
    }
  });

  it("replacing the photo removes the earlier sizes and original when no other product uses them", async () => {
    const first = await t.http().put(`/api/products/${productId}/photo`).set(auth(owner)).attach("photo", await sharp({ create: { width: 300, height: 300, channels: 3, background: "#aa7744" } }).png().toBuffer(), { filename: "a.png" });
    const [was] = await t.ds.query("SELECT photoFile, photoThumbFile, photoOriginalFile FROM product WHERE id = ?", [productId]);
    const second = await t.http().put(`/api/products/${productId}/photo`).set(auth(owner)).attach("photo", await sharp({ create: { width: 300, height: 300, channels: 3, background: "#335577" } }).png().toBuffer(), { filename: "b.png" });
    expect(first.status).toBe(200);
    expect(second.status).toBe(200);
    expect(second.body.product.photoUrl).not.toBe(first.body.product.photoUrl);
    for (const f of [was.photoFile, was.photoThumbFile]) expect(fs.existsSync(path.join(t.ctx.config.uploadsDir, f))).toBe(false);
    expect(fs.existsSync(path.join(t.ctx.config.uploadsDir, "originals", was.photoOriginalFile))).toBe(false);
    expect((await t.http().get(first.body.product.photoUrl)).status).toBe(404);
    expect((await t.http().get(second.body.product.photoThumbUrl)).status).toBe(200);
  });
});

describe("certificate limits", () => {
  it("expiry dates run from today to five years ahead in the bakery's time zone; outside, a 400 names the range", async () => {
    const acct = (await makeAccount(t.ds)).id;
    const range = /between today \(2026-06-10\) and 2031-06-10/;
    for (const expiresOn of ["2026-06-09", "2020-01-01", "2031-06-11", "2090-01-01"]) {
      const res = await certificate(owner, acct, await pdf(`expiry ${expiresOn}`), expiresOn);
      expect(res.status).toBe(400);
      expect(res.body.error.fields.expiresOn).toMatch(range);
    }
    // Far outside any date the app takes: refused by the date schema itself, still a 400 on the field.
    const far = await certificate(owner, acct, await pdf("far"), "9999-12-31");
    expect(far.status).toBe(400);
    expect(far.body.error.fields.expiresOn).toEqual(expect.any(String));
    // 10 June is today in Chicago although UTC is already on 11 June; 2031-06-10 is five years to the day.
    for (const expiresOn of [TODAY, "2031-06-10"]) {
      const res = await certificate(owner, acct, await pdf(`expiry ${expiresOn}`), expiresOn);
      expect(res.status).toBe(201);
    }
    const list = await t.http().get(`/api/accounts/${acct}/certificates`).set(auth(owner));
    expect(list.body.limits).toMatchObject({ expiresFrom: TODAY, expiresTo: "2031-06-10", maxCount: 10 });
    expect(list.body.certificates.map((c: { expired: boolean }) => c.expired)).toEqual([false, false]);
  });

  it("at most 10 certificates per account, counted under a lock: 12 at once → 10 stored, 2 refused with 409", async () => {
    const acct = (await makeAccount(t.ds)).id;
    const files = await Promise.all(Array.from({ length: 12 }, (_, i) => pdf(`certificate ${i}`)));
    const results = await Promise.all(files.map((f) => certificate(owner, acct, f, "2027-12-31")));
    expect(results.map((r) => r.status).sort()).toEqual([...Array(10).fill(201), 409, 409]);
    const refused = results.find((r) => r.status === 409)!;
    expect(refused.body.error.code).toBe("certificate_quota");
    expect(refused.body.error.message).toMatch(/the most one account can keep \(10\)/);
    const [{ n }] = await t.ds.query("SELECT COUNT(*) AS n FROM tax_certificate WHERE accountId = ?", [acct]);
    expect(Number(n)).toBe(10);
    // Full: refused before the body is read.
    const more = await certificate(owner, acct, await pdf("one more"), "2027-12-31");
    expect(more.status).toBe(409);
  });

  it("at most 20 MB stored per account (413 with what is left), and at most 10 MB per file", async () => {
    const acctBuyer = await makeUser(t.ds, "buyer");
    const token = await tokenFor(t, acctBuyer);
    const acct = acctBuyer.accountId!;
    const nine = 9.5 * 1024 * 1024;
    expect((await certificate(token, acct, await pdf("big one", nine), "2027-03-31")).status).toBe(201);
    expect((await certificate(token, acct, await pdf("big two", nine), "2027-03-31")).status).toBe(201);
    const before = storedFiles("certificates");
    const third = await certificate(token, acct, await pdf("big three", 2 * 1024 * 1024), "2027-03-31");
    expect(third.status).toBe(413);
    expect(third.body.error.code).toBe("storage_quota");
    expect(third.body.error.message).toMatch(/at most 20 MB of certificates; this account uses 19 MB/);
    expect(third.body.error.message).toMatch(/Upload a file under 1 MB/);
    expect(storedFiles("certificates")).toEqual(before);
    const small = await certificate(token, acct, await pdf("small"), "2027-03-31");
    expect(small.status).toBe(201);
    const huge = await certificate(token, acct, await pdf("huge", 10 * 1024 * 1024 + 1), "2027-03-31");
    expect(huge.status).toBe(413);
    expect(huge.body.error.message).toMatch(/larger than 10 MB/);
  });
});

describe("polyglots are refused or re-encoded", () => {
  it("a PNG photo with an HTML tail after IEND is re-encoded: what is stored and served ends at IEND and has no HTML", async () => {
    const evil = Buffer.concat([png(4), HTML_TAIL]);
    const up = await t.http().put(`/api/products/${productId}/photo`).set(auth(owner)).attach("photo", evil, { filename: "rolls.png" });
    expect(up.status).toBe(200);
    const served = await t.http().get(up.body.product.photoUrl).buffer(true);
    const body = served.body as Buffer;
    expect(body.includes("<script")).toBe(false);
    expect(body.includes("<html")).toBe(false);
    expect(await sharp(body).metadata()).toMatchObject({ format: "webp", width: 4, height: 1 });
    // The private original is the re-encoded PNG: it ends at IEND.
    const [row] = await t.ds.query("SELECT photoOriginalFile FROM product WHERE id = ?", [productId]);
    const original = fs.readFileSync(path.join(t.ctx.config.uploadsDir, "originals", row.photoOriginalFile));
    expect(original.includes("<script")).toBe(false);
    expect(original.subarray(original.length - 12).equals(IEND)).toBe(true);
  });

  it("a JPEG photo loses its metadata and anything after EOI", async () => {
    const jpeg = await sharp({ create: { width: 8, height: 6, channels: 3, background: "#c8a060" } }).jpeg().withExif({ IFD0: { Artist: "<script>alert(1)</script>" } }).toBuffer();
    const evil = Buffer.concat([jpeg, HTML_TAIL]);
    const up = await t.http().put(`/api/products/${productId}/photo`).set(auth(owner)).attach("photo", evil, { filename: "rolls.jpg" });
    expect(up.status).toBe(200);
    const served = (await t.http().get(up.body.product.photoUrl).buffer(true)).body as Buffer;
    expect(served.includes("<script")).toBe(false);
    const meta = await sharp(served).metadata();
    expect(meta.exif).toBeUndefined();
    const [row] = await t.ds.query("SELECT photoOriginalFile FROM product WHERE id = ?", [productId]);
    const original = fs.readFileSync(path.join(t.ctx.config.uploadsDir, "originals", row.photoOriginalFile));
    expect(original.includes("<script")).toBe(false);
    expect(original.subarray(original.length - 2).equals(Buffer.from([0xff, 0xd9]))).toBe(true); // ends at EOI
    expect((await sharp(original).metadata()).exif).toBeUndefined();
  });

  it("a PNG certificate with an HTML tail is stored without it", async () => {
    const up = await certificate(buyer, accountId, Buffer.concat([png(2), HTML_TAIL]), "2027-05-31", "scan.png");
    expect(up.status).toBe(201);
    const file = await t.http().get(`/api/certificates/${up.body.certificate.id}/file`).set(auth(buyer)).buffer(true).parse((res, cb) => {
      const parts: Buffer[] = [];
      res.on("data", (c: Buffer) => parts.push(c));
      res.on("end", () => cb(null, Buffer.concat(parts)));
    });
    expect(file.headers["content-type"]).toBe("image/png");
    const body = file.body as Buffer;
    expect(body.includes("<script")).toBe(false);
    expect(body.subarray(body.length - 12).equals(IEND)).toBe(true);
  });

  it("a \"PDF\" that is an HTML page with a %PDF header line is refused with 415, and nothing is stored", async () => {
    const before = storedFiles("certificates");
    const fake = Buffer.from(`%PDF-1.7\n<!DOCTYPE html>\n<html><body><script>document.title='x'</script></body></html>\n%startxref\n%%EOF\n`);
    const res = await certificate(buyer, accountId, fake, "2027-05-31", "certificate.pdf");
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe("unsupported_media_type");
    expect(res.body.error.message).toMatch(/web-page code/);
    // No end-of-file trailer: not a complete PDF.
    const cut = await pdf("cut short");
    const truncated = await certificate(buyer, accountId, cut.subarray(0, cut.length - 40), "2027-05-31");
    expect(truncated.status).toBe(415);
    expect(truncated.body.error.message).toMatch(/not a complete PDF/);
    // Not a PDF at all, whatever its name: HTML, and a GIF.
    for (const bytes of [Buffer.from("<html><script>alert(1)</script></html>"), Buffer.from("GIF89a\x01\x00\x01\x00\x00\x00\x00;", "binary")]) {
      const other = await certificate(buyer, accountId, bytes, "2027-05-31", "certificate.pdf");
      expect(other.status).toBe(415);
    }
    expect(storedFiles("certificates")).toEqual(before);
  });

  it("a damaged image (PNG signature, cut short) is refused with 415", async () => {
    const cut = png(16).subarray(0, 40);
    const res = await t.http().put(`/api/products/${productId}/photo`).set(auth(owner)).attach("photo", cut, { filename: "rolls.png" });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/could not be read as an image/);
  });

  it("roles: the baker cannot upload certificates or photos", async () => {
    expect((await certificate(baker, accountId, await pdf("baker"), "2027-05-31")).status).toBe(403);
    expect((await t.http().put(`/api/products/${productId}/photo`).set(auth(baker)).attach("photo", png(), { filename: "a.png" })).status).toBe(403);
  });
});
