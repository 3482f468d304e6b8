/**
 * The content hash (engineering content only) of the heaviest accepted project: in this process
 * and through the sheet worker pool. The withdrawal check of every write to an approved job pays
 * it, so it runs on the pool; this shows what the request thread is spared.
 */
import { engineeringHash } from '../server/modules/review/content-hash';
import { createSheetWork } from '../server/workers/sheet-pool';
import { AT_LIMITS } from './bounded.bench';
import { heavySheetInput } from './heavy-project';
import { tenPlacementInput } from './sheet.bench';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export async function runReviewBench(): Promise<void> {
  const input = heavySheetInput(AT_LIMITS, tenPlacementInput().catalogue);
  const inProcess: number[] = [];
  for (let i = 0; i < 7; i++) {
    const t = performance.now();
    engineeringHash(input);
    inProcess.push(performance.now() - t);
  }
  const work = createSheetWork({ budgetMs: 120_000, threads: 1 });
  await work.contentHash(input); // thread start
  const pooled: number[] = [];
  for (let i = 0; i < 5; i++) {
    const t = performance.now();
    await work.contentHash(input);
    pooled.push(performance.now() - t);
  }
  await work.close();
  console.log('content hash of the heaviest accepted project (engineering content only)');
  console.log(
    `  in this process: median ${median(inProcess).toFixed(1)} ms (would block requests that long); through the pool: median ${median(pooled).toFixed(1)} ms end to end`,
  );
}

if (require.main === module) void runReviewBench();
