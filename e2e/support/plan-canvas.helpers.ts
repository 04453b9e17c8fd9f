import { expect, type Locator, type Page } from '@playwright/test';

/** A scheme in the demo project holding this plan, made through the real API; returns its Plan URL. */
export async function schemeWithPlan(page: Page, plan: unknown, name: string): Promise<string> {
  const headers = { Origin: new URL(page.url()).origin };
  const projects = (await (await page.request.get('/api/projects')).json()) as { projects: { id: string | number }[] };
  const projectId = projects.projects[0].id;
  const created = await page.request.post(`/api/projects/${projectId}/schemes`, { data: { name }, headers });
  expect(created.status()).toBe(201);
  const scheme = ((await created.json()) as { scheme: { id: string | number; revision: number } }).scheme;
  const put = await page.request.put(`/api/schemes/${scheme.id}/plan`, { data: { revision: scheme.revision, plan }, headers });
  expect(put.status(), await put.text()).toBe(200);
  return `/projects/${projectId}/plan?scheme=${scheme.id}&level=L2`;
}

/** The Plan canvas and a plan-feet → page-pixel converter read from its data attributes. */
export async function planCanvas(page: Page, timeout = 15_000) {
  const canvas = page.getByTestId('plan-canvas');
  await expect(canvas).toHaveAttribute('data-view-scale', /\d/, { timeout });
  return canvas;
}

export async function toPage(canvas: Locator, x_ft: number, y_ft: number): Promise<{ x: number; y: number }> {
  const box = (await canvas.boundingBox())!;
  const [scale, vx, vy] = await canvas.evaluate((el) => [Number(el.dataset.viewScale), Number(el.dataset.viewX), Number(el.dataset.viewY)]);
  return { x: box.x + x_ft * scale + vx, y: box.y - y_ft * scale + vy };
}

export async function clickPlan(page: Page, canvas: Locator, x_ft: number, y_ft: number, options: { shift?: boolean } = {}) {
  const p = await toPage(canvas, x_ft, y_ft);
  await page.mouse.move(p.x, p.y);
  if (options.shift) await page.keyboard.down('Shift');
  await page.mouse.down();
  await page.mouse.up();
  if (options.shift) await page.keyboard.up('Shift');
}

/** Plan generator for scale tests: nx × ny bays with girders east–west, beams north–south. */
export function generatedPlan(nx: number, ny: number, beamsPerBay: number, bay_ft = 30) {
  const members: unknown[] = [];
  const columns: unknown[] = [];
  const level = 'L2';
  for (let i = 0; i <= nx; i++) for (let j = 0; j <= ny; j++) columns.push({ id: `c${i}_${j}`, x_ft: i * bay_ft, y_ft: j * bay_ft, levels: [level] });
  for (let j = 0; j <= ny; j++) for (let i = 0; i < nx; i++) members.push({ id: `g${i}_${j}`, level, kind: 'girder', start: [i * bay_ft, j * bay_ft], end: [(i + 1) * bay_ft, j * bay_ft], shape: null, maxDepth_in: null });
  for (let i = 0; i <= nx; i++) for (let j = 0; j < ny; j++) members.push({ id: `e${i}_${j}`, level, kind: 'beam', start: [i * bay_ft, j * bay_ft], end: [i * bay_ft, (j + 1) * bay_ft], shape: null, maxDepth_in: null });
  for (let i = 0; i < nx; i++)
    for (let j = 0; j < ny; j++)
      for (let k = 1; k <= beamsPerBay; k++) {
        const x = i * bay_ft + (k * bay_ft) / (beamsPerBay + 1);
        members.push({ id: `b${i}_${j}_${k}`, level, kind: 'beam', start: [x, j * bay_ft], end: [x, (j + 1) * bay_ft], shape: null, maxDepth_in: null });
      }
  const grids = [
    ...Array.from({ length: nx + 1 }, (_, i) => ({ id: `gx${i}`, axis: 'x', label: String(i + 1), offset_ft: i * bay_ft })),
    ...Array.from({ length: ny + 1 }, (_, j) => ({ id: `gy${j}`, axis: 'y', label: j < 26 ? String.fromCharCode(65 + j) : `A${String.fromCharCode(65 + (j % 26))}`, offset_ft: j * bay_ft })),
  ];
  return {
    format: 'baywright-plan',
    version: 1,
    name: `Generated ${members.length}-member level (invented)`,
    designBasis: { method: 'LRFD', Fy_ksi: 50, liveLoadReduction: true, deflectionLimits: { live: 360, total: 240 } },
    grids,
    levels: [{ id: level, name: 'Level 2', elevation_ft: 14 }],
    columns,
    members,
    zones: [{ id: 'office', name: 'Office', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 15, live_psf: 50, liveReducible: true, roofLive_psf: 0, snow_psf: 0 }],
    decks: [{ id: 'd1', level, polygon: [[0, 0], [nx * bay_ft, 0], [nx * bay_ft, ny * bay_ft], [0, ny * bay_ft]], spanDirection: 'x', zone: 'office' }],
    pointLoads: [],
    lineLoads: [],
    openings: [],
  };
}
