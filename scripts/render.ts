/**
 * Render one frame request to an image file on all cores:
 *   npm run render -- <request.json> <out.png|out.jpg> [--threads N]
 * Prints progress and the time taken (worker start-up, which loads
 * TypeScript through tsx, is shown apart from the frame itself). The output
 * format comes from the request's output.format (png8, png16, jpeg);
 * --threads 0 renders in this process without workers.
 */
import fs from 'node:fs';
import os from 'node:os';
import { createRenderPool, renderFrameToImage } from '../lib/render/node/renderFrame';
import { listNonPhysicalChoices, parseFrameRequest } from '../lib/render/schema';

function usage(): never {
  console.error('usage: npm run render -- <request.json> <out.png> [--threads N]');
  process.exit(2);
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  const threadsAt = args.indexOf('--threads');
  let threads = os.availableParallelism();
  if (threadsAt >= 0) {
    threads = Number(args[threadsAt + 1]);
    if (!Number.isInteger(threads) || threads < 0 || threads > 64) usage();
    args.splice(threadsAt, 2);
  }
  if (args.length !== 2) usage();
  const [requestFile, outFile] = args;
  const req = parseFrameRequest(JSON.parse(fs.readFileSync(requestFile, 'utf8')));
  console.log(`rendering ${req.width} x ${req.height} ${req.projection.kind} (${req.output.format}) on ${threads || 'no worker'} thread(s)`);
  for (const line of listNonPhysicalChoices(req)) console.log(`  note: ${line}`);
  const t0 = performance.now();
  const pool = threads > 0 ? createRenderPool(threads) : null;
  try {
    if (pool) {
      await pool.ready();
      console.log(`  workers started in ${((performance.now() - t0) / 1000).toFixed(2)} s`);
    }
    let lastShown = -1;
    const result = await renderFrameToImage(req, {
      threads: 0,
      pool: pool ?? undefined,
      onProgress: (fraction) => {
        const pct = Math.floor(fraction * 100);
        if (pct >= lastShown + 10 || pct === 100) {
          lastShown = pct;
          console.log(`  ${pct}%`);
        }
      },
    });
    fs.writeFileSync(outFile, result.bytes);
    const t = result.timings;
    console.log(
      `wrote ${outFile} (${result.bytes.length} bytes): frame ${t.totalS.toFixed(2)} s ` +
        `(ray table ${t.tableS.toFixed(2)} s, pixels and compression ${t.bandsS.toFixed(2)} s, final encoding ${t.encodeS.toFixed(2)} s), ` +
        `${((performance.now() - t0) / 1000).toFixed(2)} s in all`,
    );
  } finally {
    await pool?.close();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
