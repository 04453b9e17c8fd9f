/**
 * Member sizing benchmark: 10,000 random simple-span members (fixed seed; spans 10–45 ft,
 * loads 0.2–3 klf, mixed bracing, LRFD and ASD) sized in one process. Target ≥ 20,000/s.
 */
import { designMember, type MemberDesignInput, type MemberLoad } from '../../shared/engine/index';

export interface BenchReport {
  name: string; count: number; seconds: number; perSecond: number;
  /** Members per second of this process's CPU time (user + system): the one-core figure on a shared machine. */
  cpuSeconds: number; perCpuSecond: number;
  /** First pass, JIT cold (includes warm-up), for honesty. */
  coldPerSecond: number;
  peakRssMb: number; peakHeapMb: number; passed: number;
}

/** Mulberry32: small deterministic PRNG so every run sizes the same members. */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function randomMembers(count: number, seed = 20260101): MemberDesignInput[] {
  const rnd = mulberry32(seed);
  const between = (lo: number, hi: number): number => lo + (hi - lo) * rnd();
  const out: MemberDesignInput[] = [];
  for (let i = 0; i < count; i++) {
    const span = Math.round(between(10, 45) * 4) / 4;
    const loads: MemberLoad[] = [
      { case: 'D', kind: 'uniform', w_klf: between(0.2, 1.5) },
      { case: 'L', kind: 'uniform', w_klf: between(0.2, 1.5) },
    ];
    const r = rnd();
    if (r < 0.3) loads.push({ case: 'L', kind: 'point', P_kip: between(2, 15), x_ft: between(0.1, 0.9) * span });
    else if (r < 0.5) {
      const a = between(0, 0.5) * span;
      loads.push({ case: 'D', kind: 'partial', w_klf: between(0.2, 1), from_ft: a, to_ft: a + between(0.2, 0.5) * span });
    } else if (r < 0.6) loads.push({ case: 'S', kind: 'linear', w1_klf: between(0.2, 1), w2_klf: between(0.2, 1), from_ft: 0, to_ft: span * 0.6 });
    const b = rnd();
    const bracing: MemberDesignInput['bracing'] = b < 0.5 ? 'continuous' : b < 0.7 ? 'none' : { points_ft: [span / 3, (2 * span) / 3] };
    out.push({
      span_ft: span, loads, bracing, method: rnd() < 0.5 ? 'LRFD' : 'ASD', Fy_ksi: 50,
      deflectionLimits: { live: 360, total: 240 }, includeSelfWeight: true,
    });
  }
  return out;
}

export function runMemberBench(count = 10000): BenchReport {
  const members = randomMembers(count);
  let peakRss = process.memoryUsage().rss;
  let peakHeap = process.memoryUsage().heapUsed;
  // Warm-up pass on other members (same generator, another seed): caches and JIT.
  const warm = randomMembers(2000, 7);
  const w0 = process.hrtime.bigint();
  for (const m of warm) designMember(m);
  const coldPerSecond = warm.length / (Number(process.hrtime.bigint() - w0) / 1e9);
  let passed = 0;
  const c0 = process.cpuUsage();
  const t0 = process.hrtime.bigint();
  for (let i = 0; i < members.length; i++) {
    if (designMember(members[i]).passes) passed++;
    if ((i & 1023) === 0) {
      const m = process.memoryUsage();
      if (m.rss > peakRss) peakRss = m.rss;
      if (m.heapUsed > peakHeap) peakHeap = m.heapUsed;
    }
  }
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
  const cpu = process.cpuUsage(c0);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  const m = process.memoryUsage();
  peakRss = Math.max(peakRss, m.rss);
  peakHeap = Math.max(peakHeap, m.heapUsed);
  return {
    name: 'member sizing', count, seconds, perSecond: count / seconds, cpuSeconds, perCpuSecond: count / cpuSeconds, coldPerSecond,
    peakRssMb: peakRss / 2 ** 20, peakHeapMb: peakHeap / 2 ** 20, passed,
  };
}
