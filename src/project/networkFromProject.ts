import type { Network } from '../circuit/network.js';
import type { Project } from './types.js';

/**
 * The general circuit of any project (model.md 1.1): the PWM pin from pwm.high, pwm.low and
 * pwm.driver, period 1 / pwm.frequency, pwm.alignment, the load as in ladderFromProject.ts, and
 * the stages in file order with the second PWM output when the file has `network`; else the RC
 * stages of filter.stages and no second output. A design-only file gives no stages.
 *
 * Syntax: networkFromProject(project)
 * Example: networkFromProject(p).second?.r   // 2.56e6 for a fine channel weighted in through 2.56 Mohm
 */
export function networkFromProject(project: Project): Network {
  const { pwm, load, network } = project;
  return {
    period: 1 / pwm.frequency,
    alignment: pwm.alignment,
    pin: { high: pwm.high, low: pwm.low, driverHigh: pwm.driver.high, driverLow: pwm.driver.low },
    stages: network ? network.stages : project.filter.stages.map((s) => ({ kind: 'rc', r: s.r, c: s.c, buffered: s.buffered })),
    second: network ? network.second : null,
    loadResistance: load.resistance ?? null,
    loadCapacitance: load.capacitance,
  };
}
