/** Result types of the engine. SI base units throughout (V, s, Hz, A). */

/** Periodic steady state at one duty. */
export interface OperatingPoint {
  duty: number;
  /** Time average of the output over one period, V. */
  average: number;
  /** Smallest and largest output over one period, V. */
  min: number;
  max: number;
  /** max - min, V (computed from deviations, not by subtracting min from max). */
  ripple: number;
  /** Instants of min and max within the period, s from the period start (rising edge). */
  tMin: number;
  tMax: number;
}

export interface WorstRipple {
  duty: number;
  ripple: number;
}

/** DC transfer average(D) over the used range, errors in V signed ideal minus actual (report converts to LSB). */
export interface DcTransfer {
  /** Largest |ideal - average| over the used range and where it happens. Sign kept. */
  droop: { duty: number; error: number };
  /** Endpoint-fit offset error at duty 0, ideal(0) - fit(0), V. */
  offsetError: number;
  /** Endpoint-fit gain error over the full scale, (high - low) - (fit(1) - fit(0)), V. */
  gainError: number;
  /** Largest deviation fit(D) - average(D) from the endpoint line, V (signed), and where. */
  inl: { duty: number; error: number };
}

export interface Settling {
  from: number;
  to: number;
  band: number;
  /** s after the step, or null when the steady state at `to` leaves the band. */
  time: number | null;
}

/** A sampled waveform for charts and CSV. */
export interface Waveform {
  t: number[];
  v: number[];
}

/** Periodic steady state at one duty, sampled: the output `wave` (V) and its time average. */
export interface SteadyRecord {
  duty: number;
  /** Time average of the output, V. */
  average: number;
  /** t from a rising edge, s; v the output, V. */
  wave: Waveform;
}

/** The settling step as a record: waveform plus what it should settle to. */
export interface StepRecord {
  /** t from the step, s; v the output, V. */
  wave: Waveform;
  from: number;
  to: number;
  /** Steady-state average at `to`, V. */
  final: number;
  /** Half-width of the settling band, V. */
  band: number;
  /** Settling time, s after the step, or null when the output never settles. */
  time: number | null;
}

/** Magnitude response relative to DC on a log-spaced frequency grid. */
export interface MagnitudeSeries {
  /** Hz, log-spaced, increasing. */
  frequency: number[];
  /** 20 log10 |H(j 2 pi f)| / |H(0)|, dB (0 at DC, negative above the cutoff). */
  gainDb: number[];
  /** -3 dB frequency, Hz. */
  cutoff: number;
  /** PWM frequency 1 / period, Hz. */
  pwmFrequency: number;
}

/** DC error across duties, V, signed ideal minus average (README "Sign convention"). */
export interface DcErrorSeries {
  duty: number[];
  error: number[];
}

/** Every series the analysis charts draw, one sample per plot column where the chart is a line. */
export interface ChartSeries {
  /** Plot columns the series were computed for. */
  columns: number;
  /** Two periods at the worst-ripple duty; `deviation` = output - average, V. */
  steady: { duty: number; average: number; t: number[]; deviation: number[] };
  step: StepRecord;
  magnitude: MagnitudeSeries;
  dcError: DcErrorSeries;
}

/** Base and head on one shared time grid (compare's overlay charts), V. */
export interface Overlay {
  t: number[];
  base: number[];
  head: number[];
}

/** The overlays `compare` draws: steady states (output minus ideal) and step responses (output). */
export interface CompareOverlays {
  /** At the head's worst-ripple duty, two periods of the slower PWM; output minus ideal, V. */
  steady: Overlay & { duty: number };
  /** The head's settling step; output, V. */
  step: Overlay & { from: number; to: number };
}

/** The waveforms `analyze --csv` writes: the steady state at the worst-ripple duty and the settling step. */
export interface WaveformRecords {
  steady: SteadyRecord;
  step: StepRecord;
}
