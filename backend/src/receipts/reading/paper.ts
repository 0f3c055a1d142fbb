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

export async function findPaper(upright: Sharp, width: number, height: number): Promise<PaperLayout> {
  const scale = Math.min(1, SAMPLE_WIDTH / width);
  const sampleWidth = Math.max(1, Math.round(width * scale));
  const { data, info } = await upright.clone().greyscale().resize({ width: sampleWidth }).raw().toBuffer({ resolveWithObject: true });
  const w = info.width;
  const h = info.height;
  const pixels = new Uint8Array(data.buffer, data.byteOffset, w * h);
  const at = (x: number, y: number) => pixels[y * w + x];

  // A photo: the border is much darker than the middle. The paper is then the bright region.
  const border: number[] = [];
  const middle: number[] = [];
  for (let y = 0; y < h; y += 2) {
    for (let x = 0; x < w; x += 2) {
      const edge = x < w * 0.04 || x > w * 0.96 || y < h * 0.03 || y > h * 0.97;
      const centre = x > w * 0.3 && x < w * 0.7 && y > h * 0.3 && y < h * 0.7;
      if (edge) border.push(at(x, y));
      else if (centre) middle.push(at(x, y));
    }
  }
  const mean = (values: number[]) => values.reduce((sum, value) => sum + value, 0) / Math.max(values.length, 1);
  const background = mean(middle) - mean(border) > 50;
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
        if (at(x, y) > threshold) {
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
  const region: number[] = [];
  for (let y = top; y <= bottom; y += 2) for (let x = left; x <= right; x += 2) region.push(at(x, y));
  region.sort((a, b) => a - b);
  const paperLevel = region[Math.floor(region.length * 0.7)] ?? 255;
  const inkBelow = paperLevel - Math.max(40, paperLevel * 0.25);
  const inkColumns = new Array<number>(w).fill(0);
  const inkRows = new Array<number>(h).fill(0);
  for (let y = top; y <= bottom; y += 1) {
    for (let x = left; x <= right; x += 1) {
      if (at(x, y) < inkBelow) {
        inkColumns[x] += 1;
        inkRows[y] += 1;
      }
    }
  }
  const [inkLeft, inkRight] = span(inkColumns, 0.004);
  const [inkTop, inkBottom] = span(inkRows, 0.002);
  // Text rows: runs of rows with ink, split by blank rows; their median height is the size of the print.
  const rowLimit = Math.max(1, (inkRight - inkLeft) * 0.01);
  const runs: number[] = [];
  let run = 0;
  for (let y = inkTop; y <= inkBottom + 1; y += 1) {
    if (y <= inkBottom && inkRows[y] > rowLimit) run += 1;
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
  };
}
