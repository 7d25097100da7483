// The load benchmark: the built app on a free loopback port, 100 simulated drivers each walking
// a 60-step inspection (start, steps with client ids, one photo, sign), driven by autocannon.
//
//   npm run bench:load [-- --json] [-- --drivers N --steps N --rate R --groups G] [-- --profile DIR]
//                      [-- --instances N]
//
// `--instances 2` runs two `next start` processes on the one database behind a round-robin proxy
// that alternates every driver's requests between them, and checks across them that a session,
// the sign-in throttle and a step sent to both at once hold.
//
// Each autocannon connection is one driver with its own session cookie and tractor, posting its
// steps one after another. `--rate` caps the requests per second across all drivers (a yard of
// drivers does not press buttons back to back; 0 = as fast as the server answers). Afterwards a
// share of the steps is sent again, as a device does after a reconnect, and the rows are counted
// in PostgreSQL: every step exactly once. Runs on its own database (rigcall_load) so that a test
// run that re-creates rigcall_test at the same time does not pull it out from under us.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { inspect } from 'node:util';
import autocannon from 'autocannon';
import http from 'node:http';
import { createProxyServer } from 'http-proxy-3';
import { sql } from 'kysely';
import { encode } from 'next-auth/jwt';
import pg from 'pg';
import sharp from 'sharp';
import { createDb, databaseUrlFromEnv } from '../db/connect';
import { hashPassword, makeFleet, makeUnit } from '../db/factories';
import { migrateToLatest } from '../db/migrate';
import zonesGrammar from '../grammars/zones.json' with { type: 'json' };
import type { Zones } from '../lib/schemas/grammar';
import { configurationOf, DEFAULT_REQUIRED_READINGS, listOpenItems, listWalkZones } from '../lib/walk';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const args = process.argv.slice(2);
const flag = (name: string, fallback: number) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] !== undefined ? Number(args[i + 1]) : fallback;
};
const asJson = args.includes('--json');
const DRIVERS = flag('drivers', 100);
const STEPS = flag('steps', 60);
const RATE = flag('rate', 100);
const REPLAY_SHARE = 0.1;
/** `--instances N`: N `next start` processes on the one database behind a round-robin proxy. */
const INSTANCES = Math.max(1, Math.min(flag('instances', 1), 4));
if (RATE > 0 && RATE < DRIVERS) {
  console.error(
    `[bench:load] --rate ${RATE} is below one step per second per driver, the slowest autocannon paces a connection; use at least ${DRIVERS}, or 0 for no cap`,
  );
  process.exit(2);
}
const TIME_LIMIT_S = flag('time-limit', 150);
const profileAt = args.indexOf('--profile');
/** `--profile DIR`: the app writes a V8 CPU profile there when it stops (open it in Chrome's DevTools). */
const PROFILE_DIR = profileAt >= 0 && args[profileAt + 1] ? path.resolve(args[profileAt + 1]!) : null;
const log = (msg: string) => {
  if (!asJson) console.log(`[bench:load] ${msg}`);
  else console.error(`[bench:load] ${msg}`);
};

const hardStop = setTimeout(
  () => {
    console.error(`[bench:load] gave up after ${TIME_LIMIT_S + 60} s`);
    stopApp();
    process.exit(2);
  },
  (TIME_LIMIT_S + 60) * 1000,
);
hardStop.unref();

// ------------------------------------------------------------------ database

function loadDatabaseUrl(): string {
  const u = new URL(databaseUrlFromEnv());
  if (!['127.0.0.1', 'localhost', '::1'].includes(u.hostname))
    throw new Error(`refusing to load a database on ${u.hostname}`);
  u.pathname = '/rigcall_load';
  return u.toString();
}

async function ensureLoadDatabase(url: string) {
  const admin = new URL(url);
  admin.pathname = '/postgres';
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  const exists = await client.query(`select 1 from pg_database where datname = 'rigcall_load'`);
  if (!exists.rowCount) await client.query('create database rigcall_load');
  await client.end();
  const db = createDb(url, 2);
  await migrateToLatest(db);
  await db.destroy();
}

// ------------------------------------------------------------------ the app

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const port = (srv.address() as net.AddressInfo).port;
      srv.close(() => resolve(port));
    });
  });
}

const apps: ChildProcess[] = [];
const helpers: ChildProcess[] = [];
let balancer: http.Server | null = null;
function stopApp() {
  balancer?.close();
  for (const child of [...apps, ...helpers]) {
    if (child?.pid && child.exitCode === null) {
      try {
        process.kill(-child.pid, 'SIGTERM');
      } catch {
        /* gone */
      }
    }
  }
}

async function waitForPort(port: number, what: string) {
  const until = Date.now() + 20_000;
  while (Date.now() < until) {
    const open = await new Promise<boolean>((resolve) => {
      const sock = net.connect({ port, host: '127.0.0.1' });
      sock.once('connect', () => (sock.destroy(), resolve(true)));
      sock.once('error', () => resolve(false));
    });
    if (open) return;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`${what} did not open port ${port}`);
}

/** An object store and a mail catcher of the bench's own, so that no other run can stop them under it. */
async function startFakes(): Promise<Record<string, string>> {
  const [s3, smtp, mailHttp] = [await freePort(), await freePort(), await freePort()];
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'rigcall-bench-'));
  const spawnHelper = (script: string, args: string[]) => {
    const child = spawn(process.execPath, [script, ...args], { cwd: root, detached: true, stdio: 'ignore' });
    helpers.push(child);
  };
  spawnHelper('scripts/object-store.mjs', ['--port', String(s3), '--dir', path.join(dir, 's3'), '--bucket', 'rigcall']);
  spawnHelper('scripts/mail-catcher.mjs', [
    '--smtp',
    String(smtp),
    '--http',
    String(mailHttp),
    '--dir',
    path.join(dir, 'mail'),
  ]);
  await waitForPort(s3, 'the object store');
  await waitForPort(smtp, 'the mail catcher');
  process.on('exit', () => fs.rmSync(dir, { recursive: true, force: true }));
  return {
    S3_ENDPOINT: `http://127.0.0.1:${s3}`,
    S3_BUCKET: 'rigcall',
    S3_FORCE_PATH_STYLE: 'true',
    SMTP_URL: `smtp://127.0.0.1:${smtp}`,
    MAIL_CATCHER_URL: `http://127.0.0.1:${mailHttp}`,
  };
}
process.on('exit', stopApp);

function runBuildIfMissing(env: NodeJS.ProcessEnv) {
  if (fs.existsSync(path.join(root, '.next', 'BUILD_ID'))) return Promise.resolve();
  log('no build found; building (next build)…');
  return new Promise<void>((resolve, reject) => {
    const b = spawn(process.execPath, ['node_modules/next/dist/bin/next', 'build'], {
      cwd: root,
      env,
      stdio: asJson ? ['ignore', 'ignore', 'inherit'] : 'inherit',
    });
    b.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`next build exited with ${code}`))));
  });
}

/** Requests each instance answered through the proxy. */
const perInstance: number[] = [];

/**
 * The app: one `next start`, or INSTANCES of them on the same database, object store and mail
 * catcher behind a round-robin proxy (http-proxy-3). The proxy alternates each driver's requests
 * (by session cookie) between the instances, so every walk is written by all of them; requests
 * without a cookie alternate too. Returns the public base URL and each instance's own.
 */
async function startApp(databaseUrl: string): Promise<{ base: string; instances: string[] }> {
  const fakes = await startFakes();
  const ports = await Promise.all(Array.from({ length: INSTANCES }, () => freePort()));
  const publicPort = INSTANCES > 1 ? await freePort() : ports[0]!;
  const base = `http://127.0.0.1:${publicPort}`;
  const instances = ports.map((p) => `http://127.0.0.1:${p}`);
  fs.mkdirSync(path.join(root, '.data', 'logs'), { recursive: true });
  for (const [n, port] of ports.entries()) {
    const env = {
      ...process.env,
      ...fakes,
      DATABASE_URL: databaseUrl,
      NEXTAUTH_URL: base,
      APP_PORT: String(port),
      NODE_ENV: 'production' as const,
    };
    if (n === 0) await runBuildIfMissing(env);
    const logName = INSTANCES > 1 ? `bench-load-app-${n + 1}.log` : 'bench-load-app.log';
    const out = fs.openSync(path.join(root, '.data', 'logs', logName), 'w');
    const profile = PROFILE_DIR ? ['--cpu-prof', `--cpu-prof-dir=${PROFILE_DIR}`] : [];
    apps.push(
      spawn(
        process.execPath,
        [...profile, 'node_modules/next/dist/bin/next', 'start', '-H', '127.0.0.1', '-p', String(port)],
        {
          cwd: root,
          env,
          detached: true,
          stdio: ['ignore', out, out],
        },
      ),
    );
  }
  const until = Date.now() + 90_000;
  for (const [n, url] of instances.entries()) {
    for (;;) {
      if (apps[n]!.exitCode !== null) throw new Error(`app ${n + 1} exited at start (see .data/logs)`);
      if (Date.now() > until) throw new Error(`app ${n + 1} did not answer /api/health within 90 s`);
      const ok = await fetch(`${url}/api/health`).then(
        (r) => r.ok,
        () => false,
      );
      if (ok) break;
      await new Promise((r) => setTimeout(r, 250));
    }
  }
  if (INSTANCES > 1) {
    const agent = new http.Agent({ keepAlive: true, maxSockets: 512 });
    const proxy = createProxyServer({ agent });
    const turns = new Map<string, number>();
    let anonymous = 0;
    perInstance.push(...instances.map(() => 0));
    proxy.on('error', (_err, _req, res) => {
      if (res instanceof http.ServerResponse && !res.headersSent) res.writeHead(502).end('proxy: instance away');
    });
    balancer = http.createServer({ keepAlive: true }, (req, res) => {
      const cookie = req.headers.cookie;
      let turn: number;
      if (cookie) {
        turn = turns.get(cookie) ?? turns.size;
        turns.set(cookie, turn + 1);
      } else turn = anonymous++;
      const n = turn % instances.length;
      perInstance[n]!++;
      proxy.web(req, res, { target: instances[n] });
    });
    await new Promise<void>((resolve) => balancer!.listen(publicPort, '127.0.0.1', resolve));
  }
  return { base, instances };
}

// ------------------------------------------------------------------ the walk

type Driver = {
  id: string;
  name: string;
  cookie: string;
  tractorId: string;
  inspectionId: string;
  sent: { id: string; body: string }[];
};
// Readings that pass the default rule profile, one per required air-brake test (CDL manual
// section 5.3: build-up 85 to 100 psi within 45 s, cut-out about 125 psi, cut-in about 100 psi,
// leakage under 2 psi a minute, low-air warning before 60 psi).
const passingReading: Record<string, number> = {
  air_buildup: 30,
  governor_cutout: 125,
  governor_cutin: 105,
  air_leak: 1,
  low_air_warning: 62,
};
// The walk's items in order: the visual ones (answered "OK") and the required readings (answered
// with a passing number); optional readings are left out, as most drivers do.
const items = (
  zonesGrammar as { zones: { id: string; items: { id: string; configurations?: string[]; measure?: string }[] }[] }
).zones.flatMap((z) =>
  z.items
    .filter((i) => !i.configurations || i.configurations.includes('bobtail'))
    .filter((i) => !i.measure || passingReading[i.measure] !== undefined)
    .map((i) => ({ zone: z.id, item: i.id, reading: i.measure ? passingReading[i.measure] : undefined })),
);

/** Step n of a walk: a zone visit when the zone changes, OKs for the items, one defect. */
function stepBody(n: number): Record<string, unknown> {
  const at = items[n % items.length]!;
  const deviceAt = new Date().toISOString();
  if (n === 7)
    return {
      seq: n,
      zone: 'in_cab',
      kind: 'defect',
      termKey: 'horn:inoperative',
      heard: 'horn does not work',
      inputMode: 'voice',
      score: 0.93,
      resolution: 'auto',
      deviceAt,
    };
  if (n === 0 || at.zone !== items[(n - 1) % items.length]!.zone)
    return { seq: n, zone: at.zone, kind: 'visit', inputMode: 'tap', deviceAt };
  if (at.reading !== undefined)
    return {
      seq: n,
      zone: at.zone,
      item: at.item,
      kind: 'measurement',
      inputMode: 'voice',
      heard: String(at.reading),
      reading: { value: at.reading },
      score: 0.97,
      resolution: 'auto',
      deviceAt,
    };
  return {
    seq: n,
    zone: at.zone,
    item: at.item,
    kind: 'ok',
    heard: 'good',
    inputMode: n % 3 ? 'voice' : 'tap',
    score: 0.98,
    resolution: 'auto',
    deviceAt,
  };
}

async function pool<T>(list: T[], width: number, fn: (t: T) => Promise<void>) {
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(width, list.length) }, async () => {
      while (next < list.length) await fn(list[next++]!);
    }),
  );
}

const pct = (sorted: number[], p: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]! : 0;

async function main() {
  const t0 = Date.now();
  const url = loadDatabaseUrl();
  log(`database rigcall_load on ${new URL(url).host}`);
  await ensureLoadDatabase(url);
  const db = createDb(url, 4);
  const { base, instances } = await startApp(url);
  log(
    INSTANCES > 1 ? `${INSTANCES} instances (${instances.join(', ')}) behind the proxy at ${base}` : `app at ${base}`,
  );

  // Drivers: a user, a session cookie and a tractor each, in one fleet of their own.
  const fleet = await makeFleet(db, { name: `Load fleet ${new Date().toISOString()}` });
  const passwordHash = await hashPassword('load-password', 4);
  const secret = process.env.NEXTAUTH_SECRET;
  if (!secret) throw new Error('NEXTAUTH_SECRET is not set');
  const drivers: Driver[] = [];
  for (let i = 0; i < DRIVERS; i++) {
    const name = `Load Driver ${i + 1}`;
    const user = await db
      .insertInto('appUser')
      .values({
        fleetId: fleet.id,
        email: `load-${fleet.slug}-${i}@load.example`,
        name,
        passwordHash,
        roles: ['driver'],
        active: true,
      })
      .returning(['id'])
      .executeTakeFirstOrThrow();
    const tractor = await makeUnit(db, { fleetId: fleet.id, kind: 'tractor' });
    const token = await encode({
      secret,
      token: {
        uid: user.id,
        name,
        email: `load-${i}@load.example`,
        fleetId: fleet.id,
        roles: ['driver'],
        sub: user.id,
        // A session begun now, under the account's first session version (lib/auth/read-session-user.ts).
        sv: 1,
        signedInAt: Math.floor(Date.now() / 1000),
      } as never,
    });
    drivers.push({
      id: user.id,
      name,
      cookie: `next-auth.session-token=${token}`,
      tractorId: tractor.id,
      inspectionId: randomUUID(),
      sent: [],
    });
  }
  log(`${DRIVERS} drivers ready`);

  const headers = (d: Driver) => ({ cookie: d.cookie, 'content-type': 'application/json', origin: base });
  let otherErrors = 0;
  const note = (what: string, status: number, text: string) => {
    otherErrors++;
    if (otherErrors <= 5) log(`${what}: ${status} ${text.slice(0, 200)}`);
  };

  // Start every walk.
  await pool(drivers, 20, async (d) => {
    const res = await fetch(`${base}/api/inspections`, {
      method: 'POST',
      headers: headers(d),
      body: JSON.stringify({
        id: d.inspectionId,
        kind: 'pre_trip',
        tractorId: d.tractorId,
        trailerId: null,
        odometer: 100_000,
        startedAt: new Date().toISOString(),
      }),
    });
    if (res.status !== 201) note('start', res.status, await res.text());
  });

  // Warm-up, not counted: a fresh server compiles and optimises on its first requests. Ten
  // walks of their own (their drivers and tractors are not the measured ones), each walked by
  // one client at a time as a phone does, so that the paths of the measured walks are warm.
  {
    const WARM_WALKS = 10;
    const WARM_STEPS = 100;
    await pool(
      Array.from({ length: WARM_WALKS }, (_x, i) => i),
      WARM_WALKS,
      async (i) => {
        const warm = await db
          .insertInto('appUser')
          .values({
            fleetId: fleet.id,
            email: `warm-${i}-${fleet.slug}@load.example`,
            name: `Warm Up ${i}`,
            passwordHash,
            roles: ['driver'],
            active: true,
          })
          .returning(['id'])
          .executeTakeFirstOrThrow();
        const tractor = await makeUnit(db, { fleetId: fleet.id, kind: 'tractor' });
        const token = await encode({
          secret,
          token: {
            uid: warm.id,
            name: `Warm Up ${i}`,
            email: `warm-${i}@load.example`,
            fleetId: fleet.id,
            roles: ['driver'],
            sub: warm.id,
            sv: 1,
            signedInAt: Math.floor(Date.now() / 1000),
          } as never,
        });
        const w: Driver = {
          id: warm.id,
          name: `Warm Up ${i}`,
          cookie: `next-auth.session-token=${token}`,
          tractorId: tractor.id,
          inspectionId: randomUUID(),
          sent: [],
        };
        await fetch(`${base}/api/inspections`, {
          method: 'POST',
          headers: headers(w),
          body: JSON.stringify({
            id: w.inspectionId,
            kind: 'pre_trip',
            tractorId: w.tractorId,
            trailerId: null,
            odometer: 1,
            startedAt: new Date().toISOString(),
          }),
        });
        for (let n = 0; n < WARM_STEPS; n++) {
          const res = await fetch(`${base}/api/inspections/${w.inspectionId}/steps`, {
            method: 'POST',
            headers: headers(w),
            body: JSON.stringify({ id: randomUUID(), ...stepBody(n % STEPS), seq: n }),
          });
          await res.arrayBuffer();
        }
      },
    );
    log(`warmed up with ${WARM_WALKS} walks of ${WARM_STEPS} steps of their own`);
  }

  // The steps: GROUPS autocannon instances, each with one connection per driver of its group;
  // a connection walks its driver's STEPS requests in order (autocannon keeps a connection's
  // context through its request list, and maxConnectionRequests stops it at the end of it).
  // The groups start apart, so that the drivers' once-a-second rate budgets (autocannon's rate
  // limit is a per-second budget per connection) do not all renew at the same instant. By
  // default every driver is a group of its own: drivers in a yard do not press in step with
  // each other, and `--groups 10` (ten drivers renewing together) shows what bursts cost.
  const latencies: number[] = [];
  const statuses = new Map<number, number>();
  const perDriverRate = RATE > 0 ? RATE / DRIVERS : 0;
  const GROUPS = Math.max(1, Math.min(flag('groups', DRIVERS), DRIVERS));
  const stepsStarted = Date.now();
  const runGroup = (group: Driver[]) =>
    new Promise<autocannon.Result>((resolve, reject) => {
      let next = 0;
      const requests = Array.from({ length: STEPS }, (_x, n) => ({
        method: 'POST' as const,
        setupRequest: (req: autocannon.Request, context: Record<string, unknown>) => {
          const ctx = context as { driver?: Driver };
          ctx.driver ??= group[next++ % group.length]!;
          const d = ctx.driver;
          const id = randomUUID();
          const body = JSON.stringify({ id, ...stepBody(n) });
          d.sent.push({ id, body });
          return {
            ...req,
            method: 'POST' as const,
            path: `/api/inspections/${d.inspectionId}/steps`,
            headers: headers(d),
            body,
          };
        },
      })) as unknown as autocannon.Request[];
      const instance = autocannon(
        {
          url: base,
          connections: group.length,
          pipelining: 1,
          maxConnectionRequests: STEPS,
          ...(perDriverRate > 0 ? { connectionRate: perDriverRate } : {}),
          timeout: 10,
          duration: TIME_LIMIT_S,
          initialContext: {},
          requests,
        },
        (err: unknown, res) => (err ? reject(err instanceof Error ? err : new Error(inspect(err))) : resolve(res)),
      );
      instance.on('response', (_client: unknown, statusCode: number, _bytes: number, responseTime: number) => {
        latencies.push(responseTime);
        statuses.set(statusCode, (statuses.get(statusCode) ?? 0) + 1);
      });
    });
  const groups = Array.from({ length: GROUPS }, (_x, g) => drivers.filter((_d, i) => i % GROUPS === g));
  const results = await Promise.all(
    groups.map((group, g) => new Promise<void>((r) => setTimeout(r, (g * 1000) / GROUPS)).then(() => runGroup(group))),
  );
  const stepSeconds = (Date.now() - stepsStarted) / 1000;
  const result = {
    errors: results.reduce((a, r) => a + r.errors, 0),
    timeouts: results.reduce((a, r) => a + r.timeouts, 0),
    total: results.reduce((a, r) => a + r.requests.total, 0),
  };
  log(
    `steps phase: ${result.total} requests in ${stepSeconds.toFixed(1)} s; statuses ${JSON.stringify(Object.fromEntries(statuses))}`,
  );

  // Replays: a share of every driver's steps sent again, as after a reconnect.
  let replayErrors = 0;
  const replays = drivers.flatMap((d) =>
    d.sent.filter((_s, i) => i % Math.round(1 / REPLAY_SHARE) === 3).map((s) => ({ d, s })),
  );
  await pool(replays, 20, async ({ d, s }) => {
    const res = await fetch(`${base}/api/inspections/${d.inspectionId}/steps`, {
      method: 'POST',
      headers: headers(d),
      body: s.body,
    });
    if (res.status !== 200) {
      replayErrors++;
      note('replay', res.status, await res.text());
    }
  });

  // At the sign screen a driver answers what is still open (lib/walk's listOpenItems, the same
  // rule the server signs by): "OK" on each visual item, a passing number for each required reading.
  const walkZones = listWalkZones(zonesGrammar as Zones, { kind: 'pre_trip', configuration: configurationOf(false) });
  let answered = 0;
  await pool(drivers, 10, async (d) => {
    const recorded = d.sent.map((s) => {
      const b = JSON.parse(s.body) as { seq: number; zone: string; item?: string; kind: string; termKey?: string };
      return {
        id: s.id,
        seq: b.seq,
        zone: b.zone,
        item: b.item ?? null,
        kind: b.kind,
        termKey: b.termKey ?? null,
        undoesStepId: null,
      };
    });
    const open = listOpenItems(walkZones, recorded, { kind: 'pre_trip', requiredReadings: DEFAULT_REQUIRED_READINGS });
    let seq = Math.max(...recorded.map((r) => r.seq)) + 1;
    for (const o of open) {
      const measure = walkZones.find((z) => z.id === o.zone)?.items.find((i) => i.id === o.item)?.measure;
      const id = randomUUID();
      const deviceAt = new Date().toISOString();
      const body = JSON.stringify(
        measure && passingReading[measure] !== undefined
          ? {
              id,
              seq: seq++,
              zone: o.zone,
              item: o.item,
              kind: 'measurement',
              inputMode: 'typed',
              reading: { value: passingReading[measure] },
              deviceAt,
            }
          : { id, seq: seq++, zone: o.zone, item: o.item, kind: 'ok', inputMode: 'tap', deviceAt },
      );
      const res = await fetch(`${base}/api/inspections/${d.inspectionId}/steps`, {
        method: 'POST',
        headers: headers(d),
        body,
      });
      if (res.status !== 201 && res.status !== 200) note('answer', res.status, await res.text());
      else answered++;
      d.sent.push({ id, body });
    }
  });
  log(`${answered} open items answered before signing`);

  // One photo per driver, then sign.
  const photo = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#5a6470' } })
    .jpeg({ quality: 80 })
    .toBuffer();
  await pool(drivers, 8, async (d) => {
    const stepId = d.sent[7]?.id;
    const res = await fetch(
      `${base}/api/inspections/${d.inspectionId}/photos/${randomUUID()}${stepId ? `?stepId=${stepId}` : ''}`,
      {
        method: 'PUT',
        headers: { cookie: d.cookie, 'content-type': 'image/jpeg', origin: base },
        body: new Uint8Array(photo),
      },
    );
    if (res.status !== 201) note('photo', res.status, await res.text());
  });
  await pool(drivers, 10, async (d) => {
    const res = await fetch(`${base}/api/inspections/${d.inspectionId}/finish`, {
      method: 'POST',
      headers: headers(d),
      body: JSON.stringify({
        signatureName: d.name,
        certify: true,
        finishedAt: new Date().toISOString(),
        stepIds: d.sent.map((s) => s.id),
      }),
    });
    if (res.status !== 200) note('finish', res.status, await res.text());
  });

  // Across instances (each check talks to the instances directly, not through the proxy): a
  // session signed in on one works on the other, the sign-in throttle counts failures made on
  // either, and a step sent to both at the same moment is stored once.
  const across = INSTANCES > 1 ? await checkAcrossInstances() : null;
  async function checkAcrossInstances() {
    const [a, b] = [instances[0]!, instances[1]!];
    const person = async (tag: string) => {
      const email = `${tag}-${fleet.slug}@load.example`;
      await db
        .insertInto('appUser')
        .values({ fleetId: fleet.id, email, name: `Across ${tag}`, passwordHash, roles: ['driver'], active: true })
        .execute();
      return email;
    };
    const cookiesOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(';')[0]!);
    const signInVia = async (csrfFrom: string, postTo: string, email: string, password: string) => {
      const csrfRes = await fetch(`${csrfFrom}/api/auth/csrf`);
      const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
      const res = await fetch(`${postTo}/api/auth/callback/credentials`, {
        method: 'POST',
        redirect: 'manual',
        headers: {
          'content-type': 'application/x-www-form-urlencoded',
          cookie: cookiesOf(csrfRes).join('; '),
          origin: base,
        },
        body: new URLSearchParams({ email, password, csrfToken, json: 'true' }),
      });
      const body = (await res.json().catch(() => ({}))) as { url?: string };
      const error = new URL(body.url ?? res.headers.get('location') ?? 'http://x/').searchParams.get('error');
      const session = cookiesOf(res).filter((c) => c.startsWith('next-auth.session-token'));
      return { error, cookie: session.length ? session.join('; ') : null };
    };

    // A session from one instance on the other.
    const traveller = await person('across-session');
    const signedIn = await signInVia(a, b, traveller, 'load-password');
    const me = async (at: string) =>
      signedIn.cookie
        ? ((await (await fetch(`${at}/api/me`, { headers: { cookie: signedIn.cookie } })).json()) as {
            user?: { email?: string };
          })
        : {};
    const sessionAcross =
      signedIn.error === null && (await me(a)).user?.email === traveller && (await me(b)).user?.email === traveller;
    log(
      `session: signed in through ${b} with ${a}'s CSRF token; /api/me on both: ${sessionAcross ? 'same user' : 'FAILED'}`,
    );

    // The throttle: four wrong passwords, alternating, then the right one on either is held back.
    const guessed = await person('across-throttle');
    const tries: (string | null)[] = [];
    for (const at of [a, b, a, b]) tries.push((await signInVia(at, at, guessed, 'wrong-password')).error);
    const thenA = (await signInVia(a, a, guessed, 'load-password')).error ?? '';
    const thenB = (await signInVia(b, b, guessed, 'load-password')).error ?? '';
    const throttleAcross =
      tries.every((e) => e === 'CredentialsSignin') &&
      /Too many failed sign-ins/.test(thenA) &&
      /Too many failed sign-ins/.test(thenB);
    log(`throttle: 4 failures on alternating instances, then the right password: "${thenA}" / "${thenB}"`);

    // The same steps sent to both instances at once: each stored once, both answered 2xx.
    const tractor = await makeUnit(db, { fleetId: fleet.id, kind: 'tractor' });
    const inspectionId = randomUUID();
    const cookie = signedIn.cookie ?? '';
    const h = { cookie, 'content-type': 'application/json', origin: base };
    await fetch(`${a}/api/inspections`, {
      method: 'POST',
      headers: h,
      body: JSON.stringify({
        id: inspectionId,
        kind: 'pre_trip',
        tractorId: tractor.id,
        trailerId: null,
        odometer: 1,
        startedAt: new Date().toISOString(),
      }),
    });
    const RACE = 40;
    const raceIds: string[] = [];
    const raceStatuses: number[] = [];
    for (let n = 0; n < RACE; n++) {
      const id = randomUUID();
      raceIds.push(id);
      const body = JSON.stringify({ id, ...stepBody(n) });
      const both = await Promise.all(
        [a, b].map((at) => fetch(`${at}/api/inspections/${inspectionId}/steps`, { method: 'POST', headers: h, body })),
      );
      for (const r of both) {
        raceStatuses.push(r.status);
        await r.arrayBuffer();
      }
    }
    const raceRows = await db
      .selectFrom('inspectionStep')
      .select(['id'])
      .where('inspectionId', '=', inspectionId)
      .execute();
    const raceSeen = new Map<string, number>();
    for (const r of raceRows) raceSeen.set(r.id, (raceSeen.get(r.id) ?? 0) + 1);
    const race = {
      steps: RACE,
      answered_2xx: raceStatuses.filter((x) => x >= 200 && x < 300).length,
      lost: raceIds.filter((id) => !raceSeen.has(id)).length,
      doubled: raceRows.length - raceSeen.size + raceRows.filter((r) => !raceIds.includes(r.id)).length,
    };
    log(
      `race: ${RACE} steps each sent to both instances at once: ${race.answered_2xx}/${2 * RACE} answered 2xx, ${raceRows.length} rows, lost ${race.lost}, doubled ${race.doubled}`,
    );
    return { session_across: sessionAcross, throttle_across: throttleAcross, race };
  }

  // Count the rows.
  const inspectionIds = drivers.map((d) => d.inspectionId);
  const sentIds = new Set(drivers.flatMap((d) => d.sent.map((s) => s.id)));
  const rows = await db
    .selectFrom('inspectionStep')
    .select(['id', 'inspectionId', 'seq'])
    .where('inspectionId', 'in', inspectionIds)
    .execute();
  const seen = new Map<string, number>();
  for (const r of rows) seen.set(r.id, (seen.get(r.id) ?? 0) + 1);
  const lost = [...sentIds].filter((id) => !seen.has(id)).length;
  const bySeq = new Map<string, number>();
  for (const r of rows) bySeq.set(`${r.inspectionId}:${r.seq}`, (bySeq.get(`${r.inspectionId}:${r.seq}`) ?? 0) + 1);
  const doubled =
    [...seen.values()].filter((n) => n > 1).length +
    [...bySeq.values()].filter((n) => n > 1).length +
    rows.filter((r) => !sentIds.has(r.id)).length;
  const signed = await db
    .selectFrom('inspection')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('id', 'in', inspectionIds)
    .where('status', '=', 'submitted')
    .executeTakeFirstOrThrow();
  const photos = await db
    .selectFrom('attachment')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('inspectionId', 'in', inspectionIds)
    .executeTakeFirstOrThrow();
  const dbSize = await sql<{ size: string }>`select pg_size_pretty(pg_database_size('rigcall_load')) as size`.execute(
    db,
  );

  const non2xx = [...statuses.entries()].filter(([s]) => s < 200 || s >= 300).reduce((a, [, n]) => a + n, 0);
  const errors = result.errors + result.timeouts + non2xx + otherErrors;
  const sorted = [...latencies].sort((a, b) => a - b);
  const summary = {
    drivers: DRIVERS,
    steps: latencies.length,
    steps_per_s: Math.round((latencies.length / stepSeconds) * 10) / 10,
    p50_ms: Math.round(pct(sorted, 50) * 10) / 10,
    p95_ms: Math.round(pct(sorted, 95) * 10) / 10,
    p99_ms: Math.round(pct(sorted, 99) * 10) / 10,
    errors,
    lost,
    doubled,
    ...(across
      ? {
          instances: INSTANCES,
          requests_per_instance: perInstance,
          session_across: across.session_across,
          throttle_across: across.throttle_across,
          race_steps: across.race.steps,
          race_2xx: across.race.answered_2xx,
          race_lost: across.race.lost,
          race_doubled: across.race.doubled,
        }
      : {}),
  };

  log(
    `rate cap ${RATE > 0 ? `${RATE} requests/s` : 'none'}, drivers in ${GROUPS} pacing group(s); ${summary.steps} steps by ${DRIVERS} drivers in ${stepSeconds.toFixed(1)} s = ${summary.steps_per_s} steps/s`,
  );
  log(
    `step route latency p50 ${summary.p50_ms} ms, p95 ${summary.p95_ms} ms, p99 ${summary.p99_ms} ms, max ${sorted[sorted.length - 1] ?? 0} ms (target p99 <= 50 ms: ${summary.p99_ms <= 50 ? 'met' : 'MISSED'})`,
  );
  log(
    `errors ${errors} (step errors ${result.errors}, timeouts ${result.timeouts}, non-2xx ${non2xx}, start/replay/photo/finish ${otherErrors}); ${replays.length} steps sent again, ${replayErrors} of them not answered 200`,
  );
  log(
    `rows: ${rows.length} steps for ${sentIds.size} sent, lost ${lost}, doubled ${doubled}; ${Number(signed.n)}/${DRIVERS} reports signed, ${Number(photos.n)} photos; rigcall_load is ${dbSize.rows[0]?.size}`,
  );
  log(`total ${((Date.now() - t0) / 1000).toFixed(1)} s`);
  await db.destroy();
  stopApp();
  console.log(JSON.stringify(summary));
  const acrossOk =
    !across ||
    (across.session_across &&
      across.throttle_across &&
      across.race.lost === 0 &&
      across.race.doubled === 0 &&
      across.race.answered_2xx === 2 * across.race.steps);
  process.exit(errors === 0 && lost === 0 && doubled === 0 && acrossOk ? 0 : 1);
}

main().catch((err) => {
  console.error('[bench:load] failed:', err);
  stopApp();
  process.exit(1);
});
