/** Closed interval of values seen in a measurement. */
export type Range = { min: number; max: number };

/** What is known about one measurement; every field is optional and SI (per second for sweep rates). */
export interface MeasurementContext {
  mode?: 'four-wire' | 'two-wire';
  excitation?: 'dc' | 'dc-reversal' | 'ac';
  /** Excitation current magnitude in A (RMS for AC). */
  currentA?: number;
  /** AC excitation / reference frequency in Hz. */
  frequencyHz?: number;
  /** Local mains frequency if known; otherwise both 50 and 60 Hz are checked. */
  mainsHz?: 50 | 60;
  detection?: 'dc-voltmeter' | 'analog-lock-in' | 'digital-lock-in';
  /** Lock-in output filter time constant in s. */
  timeConstantS?: number;
  /** Number of cascaded RC poles of the lock-in filter (6 dB/octave each). */
  filterOrder?: number;
  sweep?: {
    variable: 'temperature' | 'field' | 'angle' | 'current' | 'time' | 'frequency' | 'other';
    /** Sweep rate in SI units per second (K/s, T/s, rad/s, A/s, Hz/s). */
    ratePerS?: number;
    /** Time between recorded points in s. */
    pointIntervalS?: number;
  };
  /** Voltage-contact spacing and cross-section (or thickness) are recorded, so resistivity can be computed. */
  geometryComplete?: boolean;
  resistanceOhm?: Range;
  voltageV?: Range;
  temperatureK?: Range;
  resistivityOhmM?: Range;
  carrierDensityPerM3?: number;
  mobilityM2PerVs?: number;
}

export type QualitySeverity = 'info' | 'warning' | 'serious';

/** Advice about a measurement; flags never block a deposit. */
export type QualityFlag = {
  code: string;
  severity: QualitySeverity;
  /** Plain message with the numbers in practitioner units. */
  message: string;
  /** The rule that fired, with its thresholds. */
  rule: string;
  /** "common practice" or a citation. */
  source: string;
  /** Lab-safety caution where relevant; always defers to local rules. */
  safety?: string;
};

export type QualityRule = (context: MeasurementContext) => QualityFlag[];
