import type { Project } from '../project/types.js';

/** Limits a search can relax. */
export type LimitName = 'ripple' | 'droop' | 'inl' | 'gain' | 'settling' | 'pin_current';

/**
 * The project with some limits multiplied by `factor` (Infinity removes them); limits the file
 * gave in LSB are scaled along, so a search over the resolution stays consistent. The settling
 * band is a definition, not a limit: it never changes.
 *
 * Syntax: relaxProject(project, names, factor)
 * Example: relaxProject(p, ['ripple'], Infinity).spec.ripple   // undefined
 *          relaxProject(p, ['ripple', 'droop'], 2).spec.ripple  // 2 * p.spec.ripple
 */
export function relaxProject(project: Project, names: readonly LimitName[], factor: number): Project {
  const scale = (v: number | undefined) => (v === undefined || factor === Infinity ? undefined : v * factor);
  const spec = { ...project.spec };
  const inLsb = project.specInLsb ? { ...project.specInLsb } : undefined;
  const search = project.search ? { ...project.search } : undefined;
  for (const name of names) {
    if (name === 'ripple' || name === 'droop' || name === 'inl') {
      spec[name] = scale(spec[name]);
      if (spec[name] === undefined) delete spec[name];
      if (inLsb) {
        inLsb[name] = scale(inLsb[name]);
        if (inLsb[name] === undefined) delete inLsb[name];
      }
    } else if (name === 'gain') {
      spec.gain = scale(spec.gain);
      if (spec.gain === undefined) delete spec.gain;
    } else if (name === 'settling' && spec.settling) {
      const time = scale(spec.settling.time);
      spec.settling = { ...spec.settling };
      if (time === undefined) delete spec.settling.time;
      else spec.settling.time = time;
    } else if (name === 'pin_current' && search) {
      const limit = scale(search.pinCurrent);
      if (limit === undefined) delete search.pinCurrent;
      else search.pinCurrent = limit;
    }
  }
  return { ...project, spec, ...(inLsb && { specInLsb: inLsb }), ...(search && { search }) };
}
