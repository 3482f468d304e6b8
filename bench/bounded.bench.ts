/**
 * The heaviest project the limits accept (SCENE_LIMITS at their maximum): how long its evaluation
 * and its PDF take, in this process and through the sheet worker pool, and how late a health check
 * answers while the pool works. Budget: the whole sheet (evaluate + render) within a few seconds
 * (the limits were chosen so), health within 100 ms throughout (issue 9).
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { SCENE_LIMITS } from '../shared/schemas';
import { renderSheet } from '../server/pdf/render-sheet';
import { buildSheetContent, contentHash } from '../server/pdf/sheet-model';
import { createSheetWork } from '../server/workers/sheet-pool';
import { heavySheetInput, type HeavyCounts } from './heavy-project';
import { tenPlacementInput } from './sheet.bench';

const SHEET_BUDGET_MS = 6000;
const HEALTH_BUDGET_MS = 100;

export const AT_LIMITS: HeavyCounts = {
  walls: SCENE_LIMITS.walls,
  zones: SCENE_LIMITS.zones,
  cornersPerZone: Math.min(SCENE_LIMITS.cornersPerZone, Math.floor(SCENE_LIMITS.zoneCorners / SCENE_LIMITS.zones)),
  viewers: SCENE_LIMITS.viewers,
  mirrors: SCENE_LIMITS.mirrors,
};

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export async function runBoundedBench(): Promise<void> {
  const input = heavySheetInput(AT_LIMITS, tenPlacementInput().catalogue);
  const rev = { number: 1, contentHash: '0'.repeat(64), issuedAt: new Date(Date.UTC(2026, 0, 1)) };
  console.log(`heaviest accepted project: ${JSON.stringify(AT_LIMITS)}`);

  const builds: number[] = [];
  const renders: number[] = [];
  let bytes = 0;
  for (let i = 0; i < 3; i++) {
    let t = performance.now();
    const { content } = buildSheetContent(input);
    builds.push(performance.now() - t);
    t = performance.now();
    bytes = (await renderSheet(content, { ...rev, contentHash: contentHash(content) }, 'a4')).length;
    renders.push(performance.now() - t);
  }
  const inProcess = median(builds) + median(renders);
  console.log(
    `  in this process: evaluate median ${median(builds).toFixed(0)} ms, render median ${median(renders).toFixed(0)} ms, PDF ${(bytes / 1024).toFixed(0)} KB`,
  );
  console.log(
    `  whole sheet ${inProcess.toFixed(0)} ms (budget ${SHEET_BUDGET_MS} ms) ${inProcess <= SHEET_BUDGET_MS ? 'meets' : 'MISSES'}`,
  );

  // Through the pool, with a health server on this (the request) thread polled every 20 ms.
  const work = createSheetWork({ budgetMs: 120_000, threads: 1 });
  const server = http.createServer((_req, res) => res.end('{"ok":true}'));
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`;
  const latencies: number[] = [];
  let polling = true;
  const poll = (async () => {
    while (polling) {
      const t0 = performance.now();
      await new Promise<void>((resolve, reject) => http.get(url, (res) => res.resume().on('end', () => resolve())).on('error', reject));
      latencies.push(performance.now() - t0);
      await new Promise((r) => setTimeout(r, 20));
    }
  })();
  let t = performance.now();
  await work.inputHash(input);
  const cold = performance.now() - t;
  t = performance.now();
  const key = await work.inputHash(input);
  const hashMs = performance.now() - t;
  t = performance.now();
  const built = await work.build(input);
  const buildMs = performance.now() - t;
  t = performance.now();
  await work.render(built.contentJson, rev);
  const renderMs = performance.now() - t;
  polling = false;
  await poll;
  server.close();
  await work.close();
  const worst = Math.max(...latencies);
  console.log(
    `  worker pool: first task (thread start, TypeScript loader) ${cold.toFixed(0)} ms; input hash ${hashMs.toFixed(0)} ms (${key.slice(0, 8)}…); evaluate ${buildMs.toFixed(0)} ms; render ${renderMs.toFixed(0)} ms`,
  );
  console.log(
    `  health while the pool worked: ${latencies.length} checks, median ${median(latencies).toFixed(1)} ms, worst ${worst.toFixed(1)} ms (budget ${HEALTH_BUDGET_MS} ms) ${worst <= HEALTH_BUDGET_MS ? 'meets' : 'MISSES'}`,
  );
}

if (require.main === module) void runBoundedBench();
