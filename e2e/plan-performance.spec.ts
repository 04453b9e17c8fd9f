import { mkdirSync, writeFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { signInAs } from './support/auth.helpers';
import { clickPlan, generatedPlan, planCanvas, schemeWithPlan } from './support/plan-canvas.helpers';

const PERF_DIR = 'artifacts/perf';

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i];
}

// Trace snapshots walk the whole DOM on every action and would be measured as long frames.
test.use({ trace: 'off' });

test.describe('plan performance', () => {
  test('when a 5,000-member level is panned and zoomed, then frame times stay smooth', async ({ page }) => {
    test.setTimeout(480_000);
    await page.setViewportSize({ width: 1600, height: 1000 });
    await signInAs(page, 'engineer@example.com');
    const plan = generatedPlan(25, 25, 6);
    const url = await schemeWithPlan(page, plan, `Pan test ${plan.members.length} members`);
    await page.goto(url);
    // Opening a 5,000-member scheme takes long on the shared machine; the figure is the gesture.
    const canvas = await planCanvas(page, 240_000);
    await expect(canvas).toHaveAttribute('data-members', String(plan.members.length));
    // Let the first design of the whole level finish so the pan is measured on its own.
    await expect(page.getByTestId('design-status')).toContainText(`${plan.members.length} members sized`, { timeout: 180_000 });

    // The display's own cadence with nothing moving (about one second of idle frames): a rAF
    // delta is a whole number of these intervals plus scheduling jitter, so a delta just over
    // 16.7 ms is a frame on time and one near twice the interval is a frame dropped.
    const idle = await page.evaluate(
      () =>
        new Promise<number[]>((resolve) => {
          const out: number[] = [];
          let last = -1;
          const tick = (t: number) => {
            if (last >= 0) out.push(t - last);
            last = t;
            if (out.length < 60) requestAnimationFrame(tick);
            else resolve(out);
          };
          requestAnimationFrame(tick);
        }),
    );
    const idleSorted = [...idle].sort((a, b) => a - b);
    const displayInterval = percentile(idleSorted, 50);

    const box = (await canvas.boundingBox())!;
    const cx = box.x + box.width / 2;
    const cy = box.y + box.height / 2;
    await page.evaluate(() => {
      const w = window as unknown as { __frames: number[]; __run: boolean };
      w.__frames = [];
      w.__run = true;
      (window as unknown as { __planDrawProbe: number[] }).__planDrawProbe = [];
      (window as unknown as { __planBitmapProbe: number[] }).__planBitmapProbe = [];
      let last = performance.now();
      const tick = (t: number) => {
        w.__frames.push(t - last);
        last = t;
        if (w.__run) requestAnimationFrame(tick);
      };
      requestAnimationFrame((t) => {
        last = t;
        requestAnimationFrame(tick);
      });
    });
    // Scripted navigation: zoom in with the wheel, pan with space-drag and the middle button, zoom out.
    await page.mouse.move(cx, cy);
    for (let i = 0; i < 12; i++) {
      await page.mouse.wheel(0, -120);
      await page.waitForTimeout(16);
    }
    await canvas.focus();
    await page.keyboard.down(' ');
    for (const [dx, dy] of [[400, 0], [0, 300], [-400, 0], [0, -300]]) {
      await page.mouse.move(cx, cy);
      await page.mouse.down();
      await page.mouse.move(cx + dx, cy + dy, { steps: 40 });
      await page.mouse.up();
    }
    await page.keyboard.up(' ');
    for (let i = 0; i < 12; i++) {
      await page.mouse.wheel(0, 120);
      await page.waitForTimeout(16);
    }
    await page.mouse.move(cx, cy);
    await page.mouse.down({ button: 'middle' });
    await page.mouse.move(cx - 300, cy - 200, { steps: 40 });
    await page.mouse.up({ button: 'middle' });
    const { frames, draws, bitmapDraws } = await page.evaluate(() => {
      const w = window as unknown as { __frames: number[]; __run: boolean; __planDrawProbe: number[]; __planBitmapProbe: number[] };
      w.__run = false;
      return { frames: w.__frames.slice(1), draws: w.__planDrawProbe, bitmapDraws: w.__planBitmapProbe };
    });
    const drawSorted = [...draws].sort((a, b) => a - b);
    const sorted = [...frames].sort((a, b) => a - b);
    const result = {
      members: plan.members.length,
      frames: frames.length,
      median_ms: Number(percentile(sorted, 50).toFixed(2)),
      p95_ms: Number(percentile(sorted, 95).toFixed(2)),
      max_ms: Number(sorted[sorted.length - 1].toFixed(2)),
      staticDraws: draws.length,
      staticDrawMedian_ms: Number(percentile(drawSorted, 50).toFixed(2)),
      staticDrawP95_ms: Number(percentile(drawSorted, 95).toFixed(2)),
      bitmapDraws: bitmapDraws.length,
      bitmapDrawP95_ms: Number(percentile([...bitmapDraws].sort((a, b) => a - b), 95).toFixed(2)),
      target_p95_ms: 16.7,
      idleMedian_ms: Number(displayInterval.toFixed(2)),
      idleP95_ms: Number(percentile(idleSorted, 95).toFixed(2)),
      // A frame dropped: a delta over 1.5 display intervals (at least one vsync missed).
      droppedFrames: frames.filter((d) => d > 1.5 * displayInterval).length,
      measuredAt: new Date().toISOString(),
      note: 'requestAnimationFrame deltas in headless Chromium (--disable-gpu) during scripted wheel zoom, space-drag and middle-button pan',
    };
    mkdirSync(PERF_DIR, { recursive: true });
    writeFileSync(`${PERF_DIR}/plan-pan.json`, `${JSON.stringify(result, null, 2)}\n`);
    console.log(
      `[perf] plan pan/zoom, ${result.members} members: median ${result.median_ms} ms, p95 ${result.p95_ms} ms (target ≤ 16.7 ms: ${result.p95_ms <= 16.7 ? 'PASS' : 'FAIL'} on the raw delta; against the display's own idle p95 ${result.idleP95_ms} ms: ${result.p95_ms <= Math.max(16.7, result.idleP95_ms) ? 'PASS' : 'FAIL'}), max ${result.max_ms} ms over ${result.frames} frames, ${result.droppedFrames} dropped (over 1.5 × the idle frame interval, median ${result.idleMedian_ms} ms, p95 ${result.idleP95_ms} ms with nothing moving); ` +
        `full static draws ${result.staticDraws} (median ${result.staticDrawMedian_ms} ms, p95 ${result.staticDrawP95_ms} ms), gesture bitmap draws ${result.bitmapDraws} (p95 ${result.bitmapDrawP95_ms} ms)`,
    );
    // During the gesture the static layer is drawn from its bitmap, not member by member: in full
    // only when a gesture has wholly ended (the scripted navigation is at most three: wheel and
    // space-drags, space released, wheel and middle-button drag; one more if a design arrives).
    expect(result.bitmapDraws).toBeGreaterThan(result.staticDraws);
    expect(result.staticDraws).toBeLessThanOrEqual(4);
    // Generous bounds: shared 2-core machine. The true figures are in the JSON.
    expect(result.frames).toBeGreaterThan(30);
    expect(result.median_ms).toBeLessThan(50);
  });

  test('when 24 point loads are added one by one on a 520-member level, then each edit has its new sizes on screen quickly', async ({ page }) => {
    test.setTimeout(300_000);
    await page.setViewportSize({ width: 1600, height: 1000 });
    await signInAs(page, 'engineer@example.com');
    const plan = generatedPlan(10, 10, 3);
    const url = await schemeWithPlan(page, plan, `Edit test ${plan.members.length} members`);
    await page.goto(url);
    const canvas = await planCanvas(page);
    const editor = page.getByTestId('plan-editor');
    await expect(page.getByTestId('design-status')).toContainText(`${plan.members.length} members sized`, { timeout: 60_000 });
    await expect(editor).toHaveAttribute('data-design-count', /\d+/);
    await canvas.focus();
    await page.keyboard.press('p');
    const times: number[] = [];
    const engine: number[] = [];
    const EDITS = 24;
    for (let i = 0; i < EDITS; i++) {
      const before = Number(await editor.getAttribute('data-design-count'));
      // On a beam line at 7.5 ft into a bay, a different bay and height each time.
      await clickPlan(page, canvas, 7.5 + 30 * (i % 10), 15 + 30 * (Math.floor(i / 10) * 3 + (i % 3)));
      // At least one new design (a stored-marks update may run a second one right after).
      await expect.poll(async () => Number(await editor.getAttribute('data-design-count')), { timeout: 30_000 }).toBeGreaterThan(before);
      times.push(Number(await editor.getAttribute('data-edit-to-sizes-ms')));
      engine.push(Number(await editor.getAttribute('data-engine-ms')));
    }
    const sorted = [...times].sort((a, b) => a - b);
    const engineSorted = [...engine].sort((a, b) => a - b);
    const result = {
      members: plan.members.length,
      edits: times.length,
      editToSizes_ms: times,
      median_ms: percentile(sorted, 50),
      p95_ms: percentile(sorted, 95),
      max_ms: sorted[sorted.length - 1],
      engine_ms: engine,
      engineMedian_ms: percentile(engineSorted, 50),
      engineP95_ms: percentile(engineSorted, 95),
      target_p95_ms: 200,
      target_max_ms: 300,
      measuredAt: new Date().toISOString(),
    };
    mkdirSync(PERF_DIR, { recursive: true });
    writeFileSync(`${PERF_DIR}/plan-edit-to-sizes.json`, `${JSON.stringify(result, null, 2)}\n`);
    console.log(
      `[perf] edit → sizes on screen, ${result.members} members, ${result.edits} edits: p50 ${result.median_ms.toFixed(0)} ms, p95 ${result.p95_ms.toFixed(0)} ms (target ≤ 200: ${result.p95_ms <= 200 ? 'PASS' : 'FAIL'}), ` +
        `max ${result.max_ms.toFixed(0)} ms (target ≤ 300: ${result.max_ms <= 300 ? 'PASS' : 'FAIL'}); engine alone p50 ${result.engineMedian_ms.toFixed(0)} ms, p95 ${result.engineP95_ms.toFixed(0)} ms (each: ${times.map((t) => t.toFixed(0)).join(', ')})`,
    );
    expect(result.edits).toBeGreaterThanOrEqual(20);
    // Generous bound on the shared 2-core machine; the verdicts against the targets are printed above.
    expect(result.median_ms).toBeLessThan(3000);
  });
});
