/** `npm run bench`: runs each benchmark module and prints its figures. Add plan benchmarks beside member. */
import { runMemberBench, type BenchReport } from './member.bench';
import { runPlanBench } from './plan.bench';
import { runStudyBench } from './study.bench';
import { runCliBench } from './cli.bench';
import { runServerBench } from './server.bench';

const benches: (() => BenchReport)[] = [runMemberBench];

for (const run of benches) {
  const r = run();
  process.stdout.write(
    `${r.name}: ${r.count} in ${r.seconds.toFixed(3)} s wall = ${Math.round(r.perSecond).toLocaleString('en-US')} members/s; ` +
      `CPU ${r.cpuSeconds.toFixed(3)} s = ${Math.round(r.perCpuSecond).toLocaleString('en-US')} members/CPU-s (one core); ` +
      `cold first pass ${Math.round(r.coldPerSecond).toLocaleString('en-US')}/s; ` +
      `${r.passed} passed; peak RSS ${r.peakRssMb.toFixed(1)} MB, peak heap ${r.peakHeapMb.toFixed(1)} MB\n`,
  );
}

runPlanBench();
runStudyBench();
// BAYWRIGHT_BENCH=engine skips the command-line and server figures (they take a minute on a shared machine).
if (process.env.BAYWRIGHT_BENCH !== 'engine') {
  runCliBench();
  await runServerBench();
}
