// Finds the receipt in a picture and the height of its print, so the OCR gets the paper alone with its letters at
// the size the model reads best. Works on a small greyscale copy: a few milliseconds per picture.
import type { Sharp } from 'sharp';

export interface PaperLayout {
  /** The region to keep, in pixels of the upright input. */
  crop: { left: number; top: number; width: number; height: number };
  /** Median height of the text rows in input pixels; null when no rows were found. */
  textHeight: number | null;
  /** True when a darker background surrounds the paper (a photo rather than a scan). */
  background: boolean;
  /** True when the paper's own brightness varies across it (a shadow, a fold, a lamp to one side). */
  unevenLight: boolean;
  /** Slope of the print rows in degrees (positive: rows descend to the right); turning the picture by minus this straightens it. */
  skewDegrees: number;
}

const SAMPLE_WIDTH = 600;

/** Otsu's threshold of a greyscale histogram (Otsu 1979, "A threshold selection method from gray-level histograms"). */
function otsu(pixels: Uint8Array): number {
  const histogram = new Array<number>(256).fill(0);
  for (const value of pixels) histogram[value] += 1;
  const total = pixels.length;
  let sumAll = 0;
  for (let level = 0; level < 256; level += 1) sumAll += level * histogram[level];
  let sumBelow = 0;
  let weightBelow = 0;
  let best = 0;
  let threshold = 128;
  for (let level = 0; level < 256; level += 1) {
    weightBelow += histogram[level];
    if (weightBelow === 0) continue;
    const weightAbove = total - weightBelow;
    if (weightAbove === 0) break;
    sumBelow += level * histogram[level];
    const meanBelow = sumBelow / weightBelow;
    const meanAbove = (sumAll - sumBelow) / weightAbove;
    const between = weightBelow * weightAbove * (meanBelow - meanAbove) ** 2;
    if (between > best) {
      best = between;
      threshold = level;
    }
  }
  return threshold;
}

/** The span holding all but `share` of the mass at each end of a profile. */
function span(profile: number[], share: number): [number, number] {
  const total = profile.reduce((sum, value) => sum + value, 0);
  if (total === 0) return [0, profile.length - 1];
  let start = 0;
  for (let seen = 0; start < profile.length; start += 1) {
    seen += profile[start];
    if (seen > total * share) break;
  }
  let end = profile.length - 1;
  for (let seen = 0; end > 0; end -= 1) {
    seen += profile[end];
    if (seen > total * share) break;
  }
  return [start, Math.max(start, end)];
}

/** Grey levels between the brightest and the dullest patch of paper above which the light is taken as uneven. */
const UNEVEN_LIGHT = 48;

/** The spread of the paper's brightness over a grid of patches: each patch's 70th percentile, brightest less dullest. */
function paperSpread(pixels: Uint8Array, w: number, area: { left: number; top: number; right: number; bottom: number }): number {
  const columns = 3;
  const rows = 6;
  const levels: number[] = [];
  const histogram = new Uint32Array(256);
  for (let row = 0; row < rows; row += 1) {
    for (let column = 0; column < columns; column += 1) {
      const x0 = area.left + Math.floor(((area.right - area.left) * column) / columns);
      const x1 = area.left + Math.floor(((area.right - area.left) * (column + 1)) / columns);
      const y0 = area.top + Math.floor(((area.bottom - area.top) * row) / rows);
      const y1 = area.top + Math.floor(((area.bottom - area.top) * (row + 1)) / rows);
      histogram.fill(0);
      let count = 0;
      for (let y = y0; y < y1; y += 2) {
        for (let x = x0; x < x1; x += 2) {
          histogram[pixels[y * w + x]] += 1;
          count += 1;
        }
      }
      if (count === 0) continue;
      for (let value = 0, seen = 0; value < 256; value += 1) {
        seen += histogram[value];
        if (seen > count * 0.7) {
          levels.push(value);
          break;
        }
      }
    }
  }
  return levels.length === 0 ? 0 : Math.max(...levels) - Math.min(...levels);
}

/** Largest slant looked for: a slip scanned or photographed more crooked than this is rare. */
const MAX_SKEW_DEGREES = 6;

/** Ink counts per row once the ink is sheared back by a slant: index `row + height` holds row `row`. */
function shearedRows(inkX: Uint16Array, inkY: Uint16Array, height: number, degrees: number, stride = 1): Float64Array {
  const slope = Math.tan((degrees * Math.PI) / 180);
  const counts = new Float64Array(height * 2 + 1);
  for (let index = 0; index < inkX.length; index += stride) {
    const row = Math.round(inkY[index] - inkX[index] * slope) + height;
    if (row >= 0 && row < counts.length) counts[row] += 1;
  }
  return counts;
}

/**
 * The slant of the print rows, by projection profiles (a common deskew method): ink sheared back by each candidate
 * angle piles into the sharpest row peaks at the true slant. Coarse steps, then finer ones around the best.
 */
function findSkew(inkX: Uint16Array, inkY: Uint16Array, height: number): number {
  if (inkX.length < 200) return 0;
  // Every ink pixel is not needed to find a slant: a few tens of thousands are plenty.
  const stride = Math.max(1, Math.floor(inkX.length / 30000));
  const sharpness = (degrees: number) => {
    let score = 0;
    for (const count of shearedRows(inkX, inkY, height, degrees, stride)) score += count * count;
    return score;
  };
  let best = 0;
  let bestScore = sharpness(0);
  for (const step of [0.5, 0.1]) {
    const centre = best;
    const reach = step === 0.5 ? MAX_SKEW_DEGREES : 0.5;
    for (let degrees = centre - reach; degrees <= centre + reach + 1e-9; degrees += step) {
      const score = sharpness(degrees);
      if (score > bestScore * 1.0001) {
        bestScore = score;
        best = degrees;
      }
    }
  }
  return Math.round(best * 10) / 10;
}

export async function findPaper(upright: Sharp, width: number, height: number): Promise<PaperLayout> {
  const scale = Math.min(1, SAMPLE_WIDTH / width);
  const sampleWidth = Math.max(1, Math.round(width * scale));
  const { data, info } = await upright.clone().greyscale().resize({ width: sampleWidth }).raw().toBuffer({ resolveWithObject: true });
  const w = info.width;
  const h = info.height;
  const pixels = new Uint8Array(data.buffer, data.byteOffset, w * h);
  // Plain loops over typed arrays: this runs on every receipt, and closures or growing arrays cost tenfold here.

  // A photo: the border is much darker than the middle. The paper is then the bright region.
  let borderSum = 0;
  let borderCount = 0;
  let middleSum = 0;
  let middleCount = 0;
  for (let y = 0; y < h; y += 2) {
    for (let x = 0; x < w; x += 2) {
      const edge = x < w * 0.04 || x > w * 0.96 || y < h * 0.03 || y > h * 0.97;
      const centre = x > w * 0.3 && x < w * 0.7 && y > h * 0.3 && y < h * 0.7;
      if (edge) {
        borderSum += pixels[y * w + x];
        borderCount += 1;
      } else if (centre) {
        middleSum += pixels[y * w + x];
        middleCount += 1;
      }
    }
  }
  const background = middleSum / Math.max(middleCount, 1) - borderSum / Math.max(borderCount, 1) > 50;
  let left = 0;
  let top = 0;
  let right = w - 1;
  let bottom = h - 1;
  if (background) {
    const threshold = otsu(pixels);
    const columns = new Array<number>(w).fill(0);
    const rows = new Array<number>(h).fill(0);
    for (let y = 0; y < h; y += 1) {
      for (let x = 0; x < w; x += 1) {
        if (pixels[y * w + x] > threshold) {
          columns[x] += 1;
          rows[y] += 1;
        }
      }
    }
    // Columns and rows mostly of paper; a dark table on both sides of a slip is left out.
    const paperColumns = columns.map((count) => (count > h * 0.25 ? count : 0));
    const paperRows = rows.map((count) => (count > w * 0.15 ? count : 0));
    [left, right] = span(paperColumns, 0.005);
    [top, bottom] = span(paperRows, 0.005);
  }

  // Ink: pixels much darker than the paper around them. Its extent, less the stray specks at each end, is the print.
  const histogram = new Array<number>(256).fill(0);
  let sampled = 0;
  for (let y = top; y <= bottom; y += 2) {
    for (let x = left; x <= right; x += 2) {
      histogram[pixels[y * w + x]] += 1;
      sampled += 1;
    }
  }
  const level = (share: number) => {
    for (let value = 0, seen = 0; value < 256; value += 1) {
      seen += histogram[value];
      if (seen > sampled * share) return value;
    }
    return 255;
  };
  const paperLevel = level(0.7);
  const unevenLight = paperSpread(pixels, w, { left, top, right, bottom }) > UNEVEN_LIGHT;
  const inkBelow = paperLevel - Math.max(40, paperLevel * 0.25);
  const inkColumns = new Array<number>(w).fill(0);
  const inkRows = new Array<number>(h).fill(0);
  const inkX = new Uint16Array(w * h);
  const inkY = new Uint16Array(w * h);
  let inkCount = 0;
  for (let y = top; y <= bottom; y += 1) {
    for (let x = left; x <= right; x += 1) {
      if (pixels[y * w + x] < inkBelow) {
        inkColumns[x] += 1;
        inkRows[y] += 1;
        inkX[inkCount] = x;
        inkY[inkCount] = y;
        inkCount += 1;
      }
    }
  }
  const [inkLeft, inkRight] = span(inkColumns, 0.004);
  const [inkTop, inkBottom] = span(inkRows, 0.002);
  // Text rows: runs of rows with ink, split by blank rows, counted on straightened rows (a slant smears them into one
  // another); their median height is the size of the print.
  const inkXs = inkX.subarray(0, inkCount);
  const inkYs = inkY.subarray(0, inkCount);
  const skewDegrees = findSkew(inkXs, inkYs, h);
  const rows = shearedRows(inkXs, inkYs, h, skewDegrees);
  const rowLimit = Math.max(1, (inkRight - inkLeft) * 0.01);
  const runs: number[] = [];
  let run = 0;
  for (let row = 0; row <= rows.length; row += 1) {
    if (row < rows.length && rows[row] > rowLimit) run += 1;
    else if (run > 0) {
      if (run >= 2) runs.push(run);
      run = 0;
    }
  }
  runs.sort((a, b) => a - b);
  const textHeight = runs.length >= 3 ? runs[Math.floor(runs.length / 2)] / scale : null;

  const margin = Math.round(12 / scale);
  const cropLeft = Math.max(0, Math.floor(inkLeft / scale) - margin);
  const cropTop = Math.max(0, Math.floor(inkTop / scale) - margin);
  const cropRight = Math.min(width, Math.ceil((inkRight + 1) / scale) + margin);
  const cropBottom = Math.min(height, Math.ceil((inkBottom + 1) / scale) + margin);
  return {
    crop: { left: cropLeft, top: cropTop, width: Math.max(1, cropRight - cropLeft), height: Math.max(1, cropBottom - cropTop) },
    textHeight,
    background,
    unevenLight,
    skewDegrees,
  };
}
