/** `npm run bench`: runs every benchmark in turn. Add new runners to the list. */
import { runOpticsBench } from './optics.bench';
import { runPlanBench } from './plan.bench';
import { runSheetBench } from './sheet.bench';
import { runBoundedBench } from './bounded.bench';

const runners: Array<() => Promise<void>> = [runOpticsBench, runSheetBench, runBoundedBench, runPlanBench];

async function main(): Promise<void> {
  for (const run of runners) await run();
}

void main();
