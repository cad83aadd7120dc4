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
