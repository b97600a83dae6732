// Pen paths of the skeleton table (letter-skeletons.ts) turned into dense polylines:
// the "M x y", "L x y" and "C x1 y1 x2 y2 x y" commands parsed, and every segment
// sampled finely enough that the nib, stamped at each sample, sweeps a smooth stroke.

/** A point in whatever frame the caller works in. */
export interface PathPoint {
  readonly x: number;
  readonly y: number;
}

/** A pen path in the skeleton syntax could not be read; the message names it. */
export class PenPathError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PenPathError';
  }
}

/** Operands each command takes. */
const OPERANDS: Readonly<Record<string, number>> = { M: 2, L: 2, C: 6 };

/**
 * The points of `path`, with every segment split into pieces at most `step` long
 * (measured on the control polygon, which is never shorter than the curve) and
 * each point mapped through `place` first. Throws PenPathError for a path that does
 * not start with M or has a command with missing or non-numeric operands.
 */
export function penPolyline(path: string, step: number, place: (p: PathPoint) => PathPoint): PathPoint[] {
  if (!(step > 0)) throw new RangeError(`The sampling step must be positive, not ${step}.`);
  const tokens = path.trim().split(/[\s,]+/);
  const points: PathPoint[] = [];
  let at = 0;
  let current: PathPoint | null = null;
  while (at < tokens.length) {
    const command = tokens[at++] ?? '';
    const count = OPERANDS[command];
    if (count === undefined) throw new PenPathError(`"${path}": "${command}" is not a pen command; use M, L or C.`);
    const values = tokens.slice(at, at + count).map(Number);
    at += count;
    if (values.length !== count || values.some((v) => !Number.isFinite(v))) throw new PenPathError(`"${path}": ${command} needs ${count} numbers.`);
    const mapped: PathPoint[] = [];
    for (let i = 0; i < count; i += 2) mapped.push(place({ x: values[i]!, y: values[i + 1]! }));
    if (command === 'M') {
      if (current !== null) throw new PenPathError(`"${path}": one stroke has one M, at its start; start a new stroke for a pen lift.`);
      current = mapped[0]!;
      points.push(current);
      continue;
    }
    if (current === null) throw new PenPathError(`"${path}": a stroke starts with M.`);
    const from: PathPoint = current;
    const control = [from, ...mapped];
    let polygon = 0;
    for (let i = 1; i < control.length; i++) polygon += Math.hypot(control[i]!.x - control[i - 1]!.x, control[i]!.y - control[i - 1]!.y);
    const pieces = Math.max(1, Math.ceil(polygon / step));
    for (let k = 1; k <= pieces; k++) points.push(command === 'L' ? lerp(from, mapped[0]!, k / pieces) : cubicAt(from, mapped[0]!, mapped[1]!, mapped[2]!, k / pieces));
    current = mapped[mapped.length - 1]!;
  }
  if (points.length === 0) throw new PenPathError(`"${path}" is empty; a stroke starts with M.`);
  return points;
}

function lerp(a: PathPoint, b: PathPoint, t: number): PathPoint {
  return { x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t };
}

function cubicAt(p0: PathPoint, p1: PathPoint, p2: PathPoint, p3: PathPoint, t: number): PathPoint {
  const u = 1 - t;
  const a = u * u * u;
  const b = 3 * u * u * t;
  const c = 3 * u * t * t;
  const d = t * t * t;
  return { x: a * p0.x + b * p1.x + c * p2.x + d * p3.x, y: a * p0.y + b * p1.y + c * p2.y + d * p3.y };
}
