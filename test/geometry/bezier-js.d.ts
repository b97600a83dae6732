// Ambient types for the parts of bezier-js 6.1.4 (npm `bezier-js`, a general-purpose
// Bézier library by Pomax) that the geometry tests use as an outside reference. The
// package ships plain JavaScript without declarations. Only what the tests call is
// declared, matching node_modules/bezier-js/src/bezier.js and utils.js.
declare module 'bezier-js' {
  export interface BezierPoint {
    x: number;
    y: number;
    /** Set by `project`: parameter of the projected point. */
    t?: number;
    /** Set by `project`: distance from the query point. */
    d?: number;
  }

  /** Candidate parameters per coordinate: roots of B′ and (for cubics) of B″, in [0, 1]. */
  export interface BezierExtrema {
    x: number[];
    y: number[];
    values: number[];
  }

  export interface BezierMinMax {
    min: number;
    mid: number;
    max: number;
    size: number;
  }

  export interface BezierBBox {
    x: BezierMinMax;
    y: BezierMinMax;
  }

  export interface BezierCurvature {
    /** Signed curvature (x′y″ − y′x″)/|B′|³; 0 where numerator or denominator is 0. */
    k: number;
    /** Radius of curvature 1/k. */
    r: number;
    dk?: number;
    adk?: number;
  }

  export interface BezierSplit {
    left: Bezier;
    right: Bezier;
    span: BezierPoint[];
  }

  export interface BezierUtils {
    /** Legendre–Gauss abscissae, n = 24, on [−1, 1]. */
    Tvalues: number[];
    /** Legendre–Gauss weights matching `Tvalues`. */
    Cvalues: number[];
    /** Roots of a derivative given as 2 (linear) or 3 (quadratic) Bernstein coefficients. */
    droots(coefficients: number[]): number[];
  }

  export class Bezier {
    constructor(...coordinates: number[]);
    constructor(points: BezierPoint[]);
    points: BezierPoint[];
    /** Hodograph control points: dpoints[0] of B′, dpoints[1] of B″. */
    dpoints: BezierPoint[][];
    order: number;
    compute(t: number): BezierPoint;
    derivative(t: number): BezierPoint;
    dderivative(t: number): BezierPoint;
    extrema(): BezierExtrema;
    bbox(): BezierBBox;
    /** Arc length by 24-point Legendre–Gauss quadrature over the whole curve. */
    length(): number;
    curvature(t: number): BezierCurvature;
    split(t: number): BezierSplit;
    split(t1: number, t2: number): Bezier;
    /** Closest point by look-up table and local linear search (approximate). */
    project(point: BezierPoint): BezierPoint;
    inflections(): number[];
    static getUtils(): BezierUtils;
  }
}
