import { designScheme } from '../../shared/engine/scheme/design-scheme.scheme';
import { regularBuildingPlan } from './plan.bench';
const b = regularBuildingPlan(24, 10, 8);
const c0 = process.cpuUsage(); const t0 = performance.now();
const r = designScheme(b);
const c = process.cpuUsage(c0);
console.log(JSON.stringify({ wall: performance.now() - t0, cpu: (c.user + c.system) / 1000, user: c.user/1000, sys: c.system/1000, n: r.members.length }));
