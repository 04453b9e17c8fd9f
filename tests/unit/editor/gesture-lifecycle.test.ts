/**
 * The Plan's pan/zoom gesture (src/features/editor/canvas/gesture-lifecycle.ts): the static layer's
 * bitmap is kept from the first step to the end of the gesture's last part — pointer, space and
 * wheel — and dropped exactly once at the end.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { GestureLifecycle } from '../../../src/features/editor/canvas/gesture-lifecycle';
import { WHEEL_GESTURE_IDLE_MS } from '../../../src/features/editor/canvas/gesture-bitmap';

function harness() {
  const state = { pointerPan: false, space: false, steps: 0, ends: 0 };
  const g = new GestureLifecycle({
    step: () => { state.steps++; },
    end: () => { state.ends++; },
    panning: () => state.pointerPan || state.space,
  });
  return { g, state };
}

describe('gesture lifecycle', () => {
  beforeEach(() => { vi.useFakeTimers(); });
  afterEach(() => { vi.useRealTimers(); });

  it('when the wheel turns and then rests, then the gesture ends once, the idle time after the last step', () => {
    const { g, state } = harness();
    for (let i = 0; i < 5; i++) {
      g.wheel();
      vi.advanceTimersByTime(16);
    }
    expect(state.steps).toBe(5);
    expect(g.running).toBe(true);
    vi.advanceTimersByTime(WHEEL_GESTURE_IDLE_MS - 17);
    expect(state.ends).toBe(0);
    vi.advanceTimersByTime(2);
    expect(state.ends).toBe(1);
    expect(g.running).toBe(false);
  });

  it('when a space-drag starts while the wheel is still settling, then the wheel going quiet does not end it; letting go of the pointer and then space does', () => {
    const { g, state } = harness();
    g.wheel();
    state.space = true;
    state.pointerPan = true;
    g.pointerDown();
    vi.advanceTimersByTime(WHEEL_GESTURE_IDLE_MS * 4); // the drag goes on, the wheel is long quiet
    expect(state.ends).toBe(0);
    state.pointerPan = false;
    g.pointerUp(); // space still held: more drags may follow on the same bitmap
    expect(state.ends).toBe(0);
    state.pointerPan = true;
    g.pointerDown();
    state.pointerPan = false;
    g.pointerUp();
    expect(state.ends).toBe(0);
    state.space = false;
    g.spaceUp();
    expect(state.ends).toBe(1);
    g.spaceUp();
    g.pointerUp();
    expect(state.ends).toBe(1);
  });

  it('when space is released in the middle of a drag, then the gesture ends with the pointer', () => {
    const { g, state } = harness();
    state.space = true;
    state.pointerPan = true;
    g.pointerDown();
    state.space = false;
    g.spaceUp();
    expect(state.ends).toBe(0);
    state.pointerPan = false;
    g.pointerUp();
    expect(state.ends).toBe(1);
  });

  it('when the wheel turns during a middle-button pan, then the gesture ends at the later of pointer up and wheel rest', () => {
    const { g, state } = harness();
    state.pointerPan = true;
    g.pointerDown();
    g.wheel();
    state.pointerPan = false;
    g.pointerUp();
    expect(state.ends).toBe(0);
    vi.advanceTimersByTime(WHEEL_GESTURE_IDLE_MS + 1);
    expect(state.ends).toBe(1);
  });

  it('when a plain click (no pan) goes down and up, then no gesture starts or ends', () => {
    const { g, state } = harness();
    g.pointerDown();
    g.pointerUp();
    expect(state).toMatchObject({ steps: 0, ends: 0 });
    expect(g.running).toBe(false);
  });

  it('when the canvas goes away during a zoom, then the pending end is dropped', () => {
    const { g, state } = harness();
    g.wheel();
    g.dispose();
    vi.advanceTimersByTime(WHEEL_GESTURE_IDLE_MS * 2);
    expect(state.ends).toBe(0);
  });
});
