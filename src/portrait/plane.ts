/**
 * The plotting plane of a phase portrait: which two states are drawn, over which window, and the
 * values at which every other state is held. Shared by the portrait modules.
 */

export interface Point2 {
  x: number;
  y: number;
}

/** Closed intervals [lo, hi] with lo < hi along each plotted axis. */
export interface PortraitWindow {
  x: [number, number];
  y: [number, number];
}

export interface PlaneFrame {
  /** Indices of the states on the horizontal and vertical axes. */
  ix: number;
  iy: number;
  window: PortraitWindow;
  /** A full state vector (length n); entries ix and iy are overwritten by the plane point. */
  held: Float64Array;
}

/** A fresh state vector: `held` with the plane point (x, y) put in. */
export function stateAt(frame: PlaneFrame, x: number, y: number): Float64Array {
  const s = frame.held.slice();
  s[frame.ix] = x;
  s[frame.iy] = y;
  return s;
}

/** Width and height of the window. */
export function windowSize(w: PortraitWindow): { width: number; height: number } {
  return { width: w.x[1] - w.x[0], height: w.y[1] - w.y[0] };
}

/**
 * Distance between two plane points measured in window fractions (each axis divided by its
 * window length), so that both axes count equally whatever their units.
 */
export function planeDistance(w: PortraitWindow, ax: number, ay: number, bx: number, by: number): number {
  const { width, height } = windowSize(w);
  return Math.hypot((ax - bx) / width, (ay - by) / height);
}

/** Whether (x, y) lies inside the window enlarged by `margin` window lengths on every side. */
export function insideWindow(w: PortraitWindow, x: number, y: number, margin: number): boolean {
  const { width, height } = windowSize(w);
  return x >= w.x[0] - margin * width && x <= w.x[1] + margin * width &&
    y >= w.y[0] - margin * height && y <= w.y[1] + margin * height;
}
