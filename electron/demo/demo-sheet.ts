// Draws one demo sheet as a 600-dpi greyscale "scan": the skeletons of
// letter-skeletons.ts written with a broad nib (broad-nib.ts) by a slightly unsteady
// hand, laid out in rows on a common baseline, on paper with a texture of fibres,
// uneven tone and a scanner's falling light, with the ink bleeding a little into the
// paper, the whole sheet turned by a fraction of a degree as if laid crooked on the
// glass, and a few specks of dust. Every random choice comes from the sheet's seed,
// so a seed always gives the same pixels.
import { sweepNib, type BroadNib, type InkCoverage, type NibSample } from './broad-nib.ts';
import { between, seededRandom, valueNoise, type Random } from './demo-random.ts';
import { DESIGN_CAP_HEIGHT, LETTER_SKELETONS, type LetterSkeleton } from './letter-skeletons.ts';
import { penPolyline, type PathPoint } from './pen-path.ts';
import type { DemoSheetSpec } from './demo-scenario.ts';

/** The scan's resolution: the common resolution for scanning lettering to trace. */
export const DEMO_DPI = 600;
/** Drawn cap height: 0.35 inch, a comfortable size for a broad nib and small enough for a compact sheet. */
const CAP_HEIGHT_INCHES = 0.35;
const PX_PER_UNIT = (CAP_HEIGHT_INCHES * DEMO_DPI) / DESIGN_CAP_HEIGHT;

/** Nib edge length, design units: 1/7 of the cap height, a usual proportion for edged-pen capitals (common practice). */
const NIB_WIDTH_UNITS = 14;
/** Nib thickness, design units: the hairline, about an eighth of the nib's edge (a worn steel nib; chosen). */
const NIB_THICKNESS_UNITS = 1.7;
/** Nib angle: 30° to the baseline, the usual pen angle of a foundational hand (common practice). */
const NIB_ANGLE_DEGREES = 30;
/** Supersampling per axis: 4 × 4 samples per pixel give coverage in 1/16 steps, finer than the scan's own noise. */
const SUPERSAMPLE = 4;
/** Distance between nib samples along a path, sheet pixels: a quarter of a hairline's width, so the sweep leaves no scallops. */
const SAMPLE_STEP_PX = 1;

/** Pressure varies by up to ±5 % of the nib width along a stroke (a steady hand; chosen). */
const PRESSURE_SWING = 0.05;
/** The hand wanders up to 0.6 design units (about 1.4 px) off the skeleton, slowly along the stroke (chosen). */
const HAND_WOBBLE_UNITS = 0.6;

/** Clear space between the ink of neighbouring letters, design units: wide enough that no two letters touch or overlap. */
const LETTER_GAP_UNITS = 32;
/** Baseline to baseline, design units: ascender (106) plus descender (32) plus room between the rows. */
const ROW_PITCH_UNITS = 180;
/** Highest and lowest ink of the alphabet above and below the baseline, design units (ascenders, descenders, Q's tail, plus a nib). */
const ASCENT_UNITS = 116;
const DESCENT_UNITS = 44;
/** Paper around the drawing: half an inch. */
const MARGIN_PX = DEMO_DPI / 2;

/** The sheet lies turned by this much on the scanner glass (clockwise, degrees): slight, as from a careful hand. */
const SHEET_ROTATION_DEGREES = 0.2;

/** Paper grey at its brightest, before the scanner's light falls off: a warm cartridge paper. */
const PAPER_GREY = 240;
/** The scanner's light falls off by this many grey levels across the sheet, left to right and top to bottom (a lid not quite closed). */
const LIGHT_FALLOFF_X = 10;
const LIGHT_FALLOFF_Y = 6;
/** Uneven paper tone: ± this many grey levels, varying over this many pixels (chosen). */
const TONE_SWING = 4;
const TONE_CELL_PX = 360;
/** Paper fibres: this many faint strands per square inch, each darkening the paper by up to this many levels. */
const FIBRES_PER_SQUARE_INCH = 25;
const FIBRE_DARKNESS = 9;
/** A fibre is 0.03 to 0.12 inch long (chosen). */
const FIBRE_LENGTH_PX = { min: 18, max: 72 } as const;

/** Ink takes this share of the light away where it is solid; ± the swing across the sheet (ink density). */
const INK_DARKNESS = 0.88;
const INK_DARKNESS_SWING = 0.04;
const INK_DENSITY_CELL_PX = 520;
/** Ink bleed: coverage blurred by a Gaussian of this many pixels, then spread by the gain (fattens edges by under a pixel). */
const BLEED_SIGMA_PX = 0.8;
const BLEED_GAIN = 1.25;

/** Dust specks, each a dark disc 0.7–1.5 px across in radius: under Stemline's default speck size (0.02 mm², about 11 px² at 600 dpi), so cleanup removes them. */
const SPECK_COUNT = 9;
const SPECK_RADIUS_PX = { min: 0.7, max: 1.5 } as const;

/** An 8-bit greyscale sheet: 0 black, 255 white, row-major. */
export interface DemoSheetRaster {
  readonly width: number;
  readonly height: number;
  readonly dpi: number;
  readonly data: Uint8Array;
}

interface PlacedLetter {
  readonly character: string;
  readonly skeleton: LetterSkeleton;
  /** Sheet position (before the sheet's rotation) of the skeleton's origin. */
  readonly originX: number;
  readonly baselineY: number;
}

/** Draws the sheet `spec` describes. Throws for a character the skeleton table does not have. */
export function renderDemoSheet(spec: DemoSheetSpec): DemoSheetRaster {
  const random = seededRandom(spec.seed);
  const { letters, width, height } = layOut(spec);
  const turn = (SHEET_ROTATION_DEGREES * Math.PI) / 180;
  const centre = { x: width / 2, y: height / 2 };
  const rotate = (p: PathPoint): PathPoint => {
    const dx = p.x - centre.x;
    const dy = p.y - centre.y;
    return { x: centre.x + dx * Math.cos(turn) - dy * Math.sin(turn), y: centre.y + dx * Math.sin(turn) + dy * Math.cos(turn) };
  };
  const nib: BroadNib = {
    width: NIB_WIDTH_UNITS * PX_PER_UNIT,
    thickness: NIB_THICKNESS_UNITS * PX_PER_UNIT,
    // y is down on the sheet: a nib edge rising 30° to the right points toward -y; the sheet's turn adds to it.
    angle: (-NIB_ANGLE_DEGREES * Math.PI) / 180 + turn,
  };

  const ink = new Float32Array(width * height);
  for (const letter of letters) {
    const place = (p: PathPoint): PathPoint => rotate({ x: letter.originX + p.x * PX_PER_UNIT, y: letter.baselineY - p.y * PX_PER_UNIT });
    const strokes = letter.skeleton.strokes.map((path) => handDrawn(penPolyline(path, SAMPLE_STEP_PX, place), random));
    addCoverage(ink, width, height, bleed(sweepNib(strokes, nib, SUPERSAMPLE)));
  }

  const paper = paperTone(random, width, height);
  const density = valueNoise(random, width, height, INK_DENSITY_CELL_PX);
  const data = new Uint8Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      const darkness = INK_DARKNESS + INK_DARKNESS_SWING * density(x, y);
      data[i] = Math.round(paper[i]! * (1 - Math.min(1, ink[i]!) * darkness));
    }
  }
  addSpecks(data, width, height, letters, random);
  return { width, height, dpi: DEMO_DPI, data };
}

/** Rows on a common baseline, letters left to right with clear space between their ink. */
function layOut(spec: DemoSheetSpec): { letters: PlacedLetter[]; width: number; height: number } {
  const overhang = (NIB_WIDTH_UNITS / 2) * PX_PER_UNIT;
  const letters: PlacedLetter[] = [];
  let widest = 0;
  spec.rows.forEach((row, r) => {
    const baselineY = MARGIN_PX + ASCENT_UNITS * PX_PER_UNIT + r * ROW_PITCH_UNITS * PX_PER_UNIT;
    let x = MARGIN_PX;
    for (const character of row) {
      const skeleton = LETTER_SKELETONS[character];
      if (skeleton === undefined) throw new RangeError(`The demo sheet "${spec.name}" asks for "${character}", which has no skeleton; add it to letter-skeletons.ts.`);
      const { min, max } = horizontalExtent(skeleton);
      letters.push({ character, skeleton, originX: x + overhang - min * PX_PER_UNIT, baselineY });
      x += (max - min) * PX_PER_UNIT + 2 * overhang + LETTER_GAP_UNITS * PX_PER_UNIT;
    }
    widest = Math.max(widest, x - LETTER_GAP_UNITS * PX_PER_UNIT);
  });
  const rows = spec.rows.length;
  const height = Math.ceil(2 * MARGIN_PX + (ASCENT_UNITS + DESCENT_UNITS + (rows - 1) * ROW_PITCH_UNITS) * PX_PER_UNIT);
  return { letters, width: Math.ceil(widest + MARGIN_PX), height };
}

/** Leftmost and rightmost x of a skeleton's path points (control points included, which bound the curves). */
function horizontalExtent(skeleton: LetterSkeleton): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (const path of skeleton.strokes) {
    const numbers = path.split(/[\s,]+/).filter((t) => /^-?[\d.]+$/.test(t)).map(Number);
    for (let i = 0; i < numbers.length; i += 2) {
      min = Math.min(min, numbers[i]!);
      max = Math.max(max, numbers[i]!);
    }
  }
  return { min, max };
}

/** The samples of one stroke as a hand draws them: wandering slowly off the path, pressing a little harder and softer. */
function handDrawn(points: readonly PathPoint[], random: Random): NibSample[] {
  const lengths = [0];
  for (let i = 1; i < points.length; i++) lengths.push(lengths[i - 1]! + Math.hypot(points[i]!.x - points[i - 1]!.x, points[i]!.y - points[i - 1]!.y));
  const total = Math.max(lengths[lengths.length - 1]!, 1);
  const wobble = HAND_WOBBLE_UNITS * PX_PER_UNIT;
  const [fx, fy, fp] = [between(random, 0.4, 1.2), between(random, 0.4, 1.2), between(random, 0.5, 1.5)];
  const [px, py, pp] = [random(), random(), random()];
  return points.map((p, i) => {
    const t = lengths[i]! / total;
    return {
      x: p.x + wobble * Math.sin(2 * Math.PI * (fx * t + px)),
      y: p.y + wobble * Math.sin(2 * Math.PI * (fy * t + py)),
      pressure: 1 + PRESSURE_SWING * Math.sin(2 * Math.PI * (fp * t + pp)),
    };
  });
}

/** Ink bleeding into the paper: the coverage blurred a little and spread, so edges soften and fatten by under a pixel. */
function bleed(coverage: InkCoverage): InkCoverage {
  const { width, height, data } = coverage;
  const radius = Math.ceil(3 * BLEED_SIGMA_PX);
  const kernel = Array.from({ length: 2 * radius + 1 }, (_, k) => Math.exp(-((k - radius) ** 2) / (2 * BLEED_SIGMA_PX ** 2)));
  const sum = kernel.reduce((a, b) => a + b, 0);
  const weights = kernel.map((w) => w / sum);
  const pass = (source: Float32Array, dx: number, dy: number): Float32Array => {
    const out = new Float32Array(source.length);
    for (let y = 0; y < height; y++) {
      for (let x = 0; x < width; x++) {
        let total = 0;
        for (let k = -radius; k <= radius; k++) {
          const sx = Math.min(width - 1, Math.max(0, x + k * dx));
          const sy = Math.min(height - 1, Math.max(0, y + k * dy));
          total += weights[k + radius]! * source[sy * width + sx]!;
        }
        out[y * width + x] = Math.min(1, total * BLEED_GAIN);
      }
    }
    return out;
  };
  // The gain is applied after each pass; the second pass spreads what the first already spread, which is the bleed wanted.
  return { ...coverage, data: pass(pass(data, 1, 0), 0, 1) };
}

function addCoverage(ink: Float32Array, width: number, height: number, coverage: InkCoverage): void {
  for (let row = 0; row < coverage.height; row++) {
    const y = coverage.y0 + row;
    if (y < 0 || y >= height) continue;
    for (let col = 0; col < coverage.width; col++) {
      const x = coverage.x0 + col;
      if (x < 0 || x >= width) continue;
      const i = y * width + x;
      // Overlapping strokes of wet ink merge: coverage adds, capped at solid.
      ink[i] = Math.min(1, ink[i]! + coverage.data[row * coverage.width + col]!);
    }
  }
}

/** The paper's grey before ink: falling light, uneven tone and fibres. */
function paperTone(random: Random, width: number, height: number): Float32Array {
  const tone = valueNoise(random, width, height, TONE_CELL_PX);
  const paper = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      paper[y * width + x] = PAPER_GREY - LIGHT_FALLOFF_X * (x / width) - LIGHT_FALLOFF_Y * (y / height) + TONE_SWING * tone(x, y);
    }
  }
  const fibres = Math.round((FIBRES_PER_SQUARE_INCH * width * height) / (DEMO_DPI * DEMO_DPI));
  for (let f = 0; f < fibres; f++) {
    let x = random() * width;
    let y = random() * height;
    let heading = random() * 2 * Math.PI;
    const length = between(random, FIBRE_LENGTH_PX.min, FIBRE_LENGTH_PX.max);
    const darkness = between(random, 0.3, 1) * FIBRE_DARKNESS;
    for (let s = 0; s < length; s++) {
      heading += between(random, -0.15, 0.15);
      x += Math.cos(heading);
      y += Math.sin(heading);
      const col = Math.floor(x);
      const row = Math.floor(y);
      if (col < 0 || row < 0 || col >= width || row >= height) break;
      paper[row * width + col] = paper[row * width + col]! - darkness;
    }
  }
  return paper;
}

/** A few dark specks on open paper (well away from every letter, so none is taken for a dot). */
function addSpecks(data: Uint8Array, width: number, height: number, letters: readonly PlacedLetter[], random: Random): void {
  const clearance = ROW_PITCH_UNITS * PX_PER_UNIT * 0.25;
  let placed = 0;
  for (let attempt = 0; placed < SPECK_COUNT && attempt < 1000; attempt++) {
    const cx = between(random, MARGIN_PX / 2, width - MARGIN_PX / 2);
    const cy = between(random, MARGIN_PX / 2, height - MARGIN_PX / 2);
    const radius = between(random, SPECK_RADIUS_PX.min, SPECK_RADIUS_PX.max);
    const nearLetter = letters.some((l) => {
      const { min, max } = horizontalExtent(l.skeleton);
      const left = l.originX + min * PX_PER_UNIT - clearance;
      const right = l.originX + max * PX_PER_UNIT + clearance;
      const top = l.baselineY - ASCENT_UNITS * PX_PER_UNIT - clearance;
      const bottom = l.baselineY + DESCENT_UNITS * PX_PER_UNIT + clearance;
      return cx >= left && cx <= right && cy >= top && cy <= bottom;
    });
    if (nearLetter) continue;
    placed++;
    for (let y = Math.floor(cy - radius - 1); y <= Math.ceil(cy + radius + 1); y++) {
      for (let x = Math.floor(cx - radius - 1); x <= Math.ceil(cx + radius + 1); x++) {
        if (x < 0 || y < 0 || x >= width || y >= height) continue;
        let inside = 0;
        for (let sy = 0; sy < SUPERSAMPLE; sy++) {
          for (let sx = 0; sx < SUPERSAMPLE; sx++) {
            if (Math.hypot(x + (sx + 0.5) / SUPERSAMPLE - cx, y + (sy + 0.5) / SUPERSAMPLE - cy) <= radius) inside++;
          }
        }
        const i = y * width + x;
        data[i] = Math.round(data[i]! * (1 - (INK_DARKNESS * inside) / (SUPERSAMPLE * SUPERSAMPLE)));
      }
    }
  }
}
