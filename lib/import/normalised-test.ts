/**
 * The normalised test: one probe placement, as the analysis library
 * (lib/analysis) and storage consume it. Series are typed arrays — never one
 * object per reading — with times as seconds from the start.
 */

export type PointRole = 'trap' | 'reference';

export interface TestSource {
  /** The uploaded file's name. */
  file: string;
  /** The entry inside a zip, when there is one. */
  entry?: string;
  /** Folder names from the zip path (an area, a date), outermost first. */
  hints: string[];
  /** 1-based physical lines of the first and last reading. */
  firstLine: number;
  lastLine: number;
}

export interface NormalisedTest {
  /** The tag as the meter wrote it (for a reference point, possibly its own name). */
  tag: string;
  role: PointRole;
  /** For a reference test: the trap it belongs to; null for trap tests and unlinked references. */
  linkedTrapTag: string | null;
  /** UTC milliseconds of the first reading. */
  startedAt: number;
  /**
   * Samples per second. With `timeOffsetsS` null the series is regular:
   * reading i was taken at startedAt + i / sampleRateHz seconds. When
   * irregular, this is the nominal rate (1 / median interval). 0 for a
   * one-reading test of unknown rate.
   */
  sampleRateHz: number;
  /** Seconds from startedAt of each reading, only when the spacing is irregular. */
  timeOffsetsS: Float64Array | null;
  sampleCount: number;
  /** Seconds from the first to the last reading. */
  durationS: number;
  /** Level in dB after unit conversion and the profile's level offset. */
  levelDb: Float32Array;
  /** Surface temperature in °C; NaN where a row had no temperature; null when the layout has none. */
  temperatureC: Float32Array | null;
  source: TestSource;
  /** Readings dropped because an earlier row had the same time (reported as problems). */
  duplicatesCollapsed: number;
  /** Rows whose time went backwards within the test (reported; the series is sorted). */
  backwardsJumps: number;
}

/** Time of reading i in seconds from the start, whichever way the test stores it. */
export function timeOffsetAt(test: NormalisedTest, i: number): number {
  if (test.timeOffsetsS) return test.timeOffsetsS[i];
  return test.sampleRateHz > 0 ? i / test.sampleRateHz : 0;
}
