/** `npm run bench`: runs every benchmark in turn. Add new runners to the list. */
import { runOpticsBench } from './optics.bench';
import { runPlanBench } from './plan.bench';
import { runSheetBench } from './sheet.bench';
import { runVehicleBench } from './vehicle.bench';
import { runBoundedBench } from './bounded.bench';
import { runLoadBench } from './load.bench';
import { runReviewBench } from './review.bench';
import { runQuickBench } from './quick.bench';
import { runAimBench } from './aim.bench';
import { runUploadsBench } from './uploads.bench';
import { runFirstLoadBench } from './firstload.bench';

const runners: (() => Promise<void>)[] = [
  runOpticsBench,
  runVehicleBench,
  runSheetBench,
  runBoundedBench,
  runReviewBench,
  runQuickBench,
  runAimBench,
  runUploadsBench,
  runPlanBench,
  runFirstLoadBench,
  runLoadBench,
];

async function main(): Promise<void> {
  // BENCH_ONLY=walls: the optics engine's wall growth table alone.
  if (process.env.BENCH_ONLY === 'walls') return runOpticsBench();
  if (process.env.BENCH_ONLY === 'load') return runLoadBench();
  // BENCH_ONLY=vehicle: vehicle scoring and the vehicle job beside the site job.
  if (process.env.BENCH_ONLY === 'vehicle') return runVehicleBench();
  // BENCH_ONLY=review: the content hash alone.
  if (process.env.BENCH_ONLY === 'review') return runReviewBench();
  // BENCH_ONLY=quick: ranking the demo catalogue for one quick-sizing question.
  if (process.env.BENCH_ONLY === 'quick') return runQuickBench();
  // BENCH_ONLY=aim: "aim at this zone" on the demo and at the project limits.
  if (process.env.BENCH_ONLY === 'aim') return runAimBench();
  // BENCH_ONLY=uploads: a 12-megapixel photo processed and a 10-page PDF plan's first page drawn.
  if (process.env.BENCH_ONLY === 'uploads') return runUploadsBench();
  // BENCH_ONLY=firstload: the built app's first load on an emulated phone (needs dist/).
  if (process.env.BENCH_ONLY === 'firstload') return runFirstLoadBench();
  for (const run of runners) await run();
}

void main();
