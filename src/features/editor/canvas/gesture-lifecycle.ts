// When the Plan's static layer is shown from a bitmap (gesture-bitmap.ts): from the first step
// of a pan or zoom until every part of the gesture has ended — the pointer is up, space is
// released and the wheel has been quiet for WHEEL_GESTURE_IDLE_MS. A pause of the wheel during a
// pointer pan, or the pointer coming up while space is still held, does not end it (the bitmap
// would be dropped mid-gesture and every later frame drawn member by member); releasing space
// or the pointer, whichever is last, does.
import { WHEEL_GESTURE_IDLE_MS } from './gesture-bitmap';

export interface GestureHooks {
  /** A step of the gesture: take the bitmap if there is none. */
  step(): void;
  /** The gesture is over: drop the bitmap and draw in full. */
  end(): void;
  /** Whether a pointer pan is under way or space is held (the tool controller's `panning`). */
  panning(): boolean;
}

export class GestureLifecycle {
  private wheelTimer: ReturnType<typeof setTimeout> | null = null;
  private active = false;

  constructor(private readonly hooks: GestureHooks, private readonly idleMs = WHEEL_GESTURE_IDLE_MS) {}

  /** Whether a gesture is under way. */
  get running(): boolean {
    return this.active;
  }

  /** After the tool controller took the pointer down: a pan (space held, middle button) starts or continues the gesture. */
  pointerDown(): void {
    if (this.hooks.panning()) this.step();
  }

  /** A wheel step: the gesture starts or goes on, and ends when the wheel stays quiet and nothing else holds it. */
  wheel(): void {
    this.step();
    if (this.wheelTimer) clearTimeout(this.wheelTimer);
    this.wheelTimer = setTimeout(() => {
      this.wheelTimer = null;
      this.settle();
    }, this.idleMs);
  }

  /** After the tool controller let the pointer go. */
  pointerUp(): void {
    this.settle();
  }

  /** After space was released (the controller no longer holds a pan for it). */
  spaceUp(): void {
    this.settle();
  }

  /** Stops the wheel timer (the canvas is going away); no end is drawn. */
  dispose(): void {
    if (this.wheelTimer) clearTimeout(this.wheelTimer);
    this.wheelTimer = null;
    this.active = false;
  }

  private step(): void {
    this.active = true;
    this.hooks.step();
  }

  /** Ends the gesture when no part of it goes on. */
  private settle(): void {
    if (!this.active || this.wheelTimer !== null || this.hooks.panning()) return;
    this.active = false;
    this.hooks.end();
  }
}
