// Minimal types for paper.js's core build (the npm package `paper`), only what the
// peer benchmark uses: a path of points simplified by its own curve fitter.
declare module 'paper/dist/paper-core.js' {
  interface PaperPoint { x: number; y: number }
  interface PaperSegment { point: PaperPoint; handleIn: PaperPoint; handleOut: PaperPoint }
  interface PaperCurve { point1: PaperPoint; handle1: PaperPoint; handle2: PaperPoint; point2: PaperPoint }
  interface PaperPath { segments: PaperSegment[]; curves: PaperCurve[]; simplify(tolerance: number): boolean; remove(): boolean }
  const paper: {
    setup(size: unknown): void;
    Size: new (width: number, height: number) => unknown;
    Point: new (x: number, y: number) => PaperPoint;
    Path: new (options: { segments: PaperPoint[]; insert?: boolean }) => PaperPath;
  };
  export default paper;
}
