// Local stand-ins for hosted services, each started on loopback by the project:
// a project-local PostgreSQL cluster and an SMTP fake. Plain Node (no npm
// packages) because it runs before `npm ci` may have happened.
import { spawn, spawnSync, execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import net from 'node:net';

export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export function log(message) {
  process.stdout.write(`[skywell] ${message}\n`);
}

export function fail(message) {
  process.stderr.write(`\n[skywell] ${message}\n\n`);
  process.exit(1);
}

/** Runs a command to completion, inheriting output; exits the process on failure. */
export function run(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: 'inherit', ...options });
  if (result.status !== 0) {
    fail(`'${command} ${args.join(' ')}' failed (exit ${result.status ?? result.signal}).`);
  }
}

function aptInstall(packages, why) {
  if (!isRoot) {
    fail(`${why} is missing. Install it with: sudo apt-get install -y ${packages.join(' ')}  (then run the command again)`);
  }
  log(`installing ${packages.join(', ')} from Debian's packages (${why})`);
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages], {
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

/** Directory holding initdb/pg_ctl of the newest installed PostgreSQL; installs it when root. */
export function ensurePostgresBinaries() {
  const find = () => {
    const root = '/usr/lib/postgresql';
    if (!fs.existsSync(root)) return null;
    const versions = fs
      .readdirSync(root)
      .filter((v) => fs.existsSync(path.join(root, v, 'bin', 'initdb')))
      .sort((a, b) => Number(b) - Number(a));
    return versions.length ? path.join(root, versions[0], 'bin') : null;
  };
  let bin = find();
  if (!bin) {
    aptInstall(['postgresql'], "PostgreSQL (Debian's postgresql package)");
    bin = find();
    if (!bin) fail('PostgreSQL was installed but no initdb was found under /usr/lib/postgresql/*/bin.');
  }
  return bin;
}

export function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return '/usr/bin/chromium';
  aptInstall(['chromium'], "Chromium for the browser tests (Debian's chromium package)");
  return '/usr/bin/chromium';
}

function portIsOpen(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

export async function waitForPort(port, what, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await portIsOpen(port)) return;
    await new Promise((r) => setTimeout(r, 150));
  }
  fail(`${what} did not start listening on 127.0.0.1:${port} within ${timeoutMs / 1000} s.`);
}

/**
 * Creates (once) and starts a PostgreSQL cluster in `dataDir`, listening on
 * 127.0.0.1:`port` only. As root the cluster belongs to the `postgres` OS user,
 * because PostgreSQL refuses to run as root. Never re-initialises existing data.
 * Returns a function that stops the cluster if this call started it.
 */
export async function startPostgres({ dataDir, port, user, password, database }) {
  const bin = ensurePostgresBinaries();
  const asOwner = (cmd, args, opts = {}) =>
    isRoot
      ? spawnSync('runuser', ['-u', 'postgres', '--', path.join(bin, cmd), ...args], { encoding: 'utf8', ...opts })
      : spawnSync(path.join(bin, cmd), args, { encoding: 'utf8', ...opts });

  const absolute = path.resolve(dataDir);
  fs.mkdirSync(path.dirname(absolute), { recursive: true });
  if (isRoot) {
    // The postgres user must be able to reach the data directory through its parents.
    for (let dir = path.dirname(absolute); dir !== '/'; dir = path.dirname(dir)) {
      const mode = fs.statSync(dir).mode;
      if ((mode & 0o001) === 0) fs.chmodSync(dir, mode | 0o001);
    }
  }

  if (!fs.existsSync(path.join(absolute, 'PG_VERSION'))) {
    log(`creating a PostgreSQL cluster in ${dataDir}`);
    fs.mkdirSync(absolute, { recursive: true, mode: 0o700 });
    const pwfile = path.join(absolute, '..', `.${path.basename(absolute)}.pw`);
    fs.writeFileSync(pwfile, `${password}\n`, { mode: 0o600 });
    if (isRoot) {
      execFileSync('chown', ['postgres:postgres', absolute, pwfile]);
    }
    const init = asOwner('initdb', [
      '-D', absolute, '-U', user, `--pwfile=${pwfile}`, '--auth-local=scram-sha-256',
      '--auth-host=scram-sha-256', '-E', 'UTF8', '--locale=C.UTF-8',
    ]);
    fs.rmSync(pwfile, { force: true });
    if (init.status !== 0) fail(`initdb failed:\n${init.stdout}\n${init.stderr}`);
    fs.appendFileSync(
      path.join(absolute, 'postgresql.conf'),
      `\n# Skywell: loopback only, project port, socket inside the cluster directory\nlisten_addresses = '127.0.0.1'\nport = ${port}\nunix_socket_directories = '${absolute}'\n`,
    );
  }

  const status = asOwner('pg_ctl', ['-D', absolute, 'status']);
  let startedHere = false;
  if (status.status !== 0) {
    const logFile = path.join(absolute, 'server.log');
    const started = asOwner('pg_ctl', ['-D', absolute, '-l', logFile, '-w', '-t', '60', '-o', `-p ${port}`, 'start']);
    if (started.status !== 0) {
      const tail = fs.existsSync(logFile) ? fs.readFileSync(logFile, 'utf8').split('\n').slice(-15).join('\n') : '';
      fail(`PostgreSQL did not start (port ${port} may be taken; set the port in the environment):\n${started.stderr}\n${tail}`);
    }
    startedHere = true;
    log(`PostgreSQL listening on 127.0.0.1:${port}`);
  } else {
    log(`PostgreSQL already running in ${dataDir}; reusing it`);
  }

  const psql = (sql, db = 'postgres') =>
    spawnSync(path.join(bin, 'psql'), ['-h', '127.0.0.1', '-p', String(port), '-U', user, '-d', db, '-tAc', sql], {
      encoding: 'utf8',
      env: { ...process.env, PGPASSWORD: password },
    });
  const exists = psql(`SELECT 1 FROM pg_database WHERE datname = '${database}'`);
  if (exists.status !== 0) fail(`cannot connect to PostgreSQL on port ${port}: ${exists.stderr}`);
  if (exists.stdout.trim() !== '1') {
    const created = psql(`CREATE DATABASE "${database}"`);
    if (created.status !== 0) fail(`could not create database ${database}: ${created.stderr}`);
    log(`created database ${database}`);
  }

  return () => {
    if (startedHere) asOwner('pg_ctl', ['-D', absolute, '-m', 'fast', '-w', 'stop']);
  };
}

/** Starts maildev (SMTP fake with a small REST API) on loopback; returns the child. */
export async function startMailFake({ smtpPort, webPort, mailDir }) {
  fs.mkdirSync(mailDir, { recursive: true });
  const child = spawn(
    process.execPath,
    [
      'node_modules/maildev/dist/bin/maildev.js', '--ip', '127.0.0.1', '--web-ip', '127.0.0.1',
      '-s', String(smtpPort), '-w', String(webPort), '--mail-directory', mailDir, '--silent',
    ],
    { stdio: ['ignore', 'ignore', 'inherit'] },
  );
  await waitForPort(smtpPort, 'the SMTP fake (maildev)');
  await waitForPort(webPort, 'the SMTP fake web API (maildev)');
  log(`SMTP fake on 127.0.0.1:${smtpPort}, its inbox at http://127.0.0.1:${webPort}`);
  return child;
}

/** Starts the S3 fake (s3rver) on loopback with its data in `dataDir`; returns the child. */
export async function startObjectStoreFake({ port, dataDir }) {
  fs.mkdirSync(dataDir, { recursive: true });
  const child = spawn(
    process.execPath,
    ['node_modules/s3rver/bin/s3rver.js', '-d', dataDir, '-a', '127.0.0.1', '-p', String(port), '--silent', '--no-vhost-buckets'],
    { stdio: ['ignore', 'ignore', 'inherit'] },
  );
  await waitForPort(port, 'the S3 fake (s3rver)');
  log(`S3 fake on http://127.0.0.1:${port} (data in ${dataDir})`);
  return child;
}
