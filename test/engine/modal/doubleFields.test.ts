import { describe, expect, it } from 'vitest';
import { DOUBLE_FIELD_SHAPES } from '../../../src/engine/modal/doubleFields.js';
import { modalLadderOf, modalLadderOfAnyOrder } from '../../../src/engine/modal/modalLadderOf.js';
import { periodicState } from '../../../src/engine/modal/periodicState.js';
import { curveExtrema } from '../../../src/engine/modal/phaseCurve.js';
import { smallState } from '../../../src/engine/modal/smallState.js';
import { steadySwing } from '../../../src/engine/modal/steadySwing.js';
import { steadyError } from '../../../src/engine/modal/stepError.js';
import { ladder } from '../ladders.js';

/**
 * doubleFields.ts only helps when its objects have the very property order of the engine's own
 * (V8 shares a layout between object literals with the same properties in the same order; common
 * practice, from V8's documentation of hidden classes, cited from memory). Not a physics check: it
 * keeps that file in step with the literals it mirrors.
 */
describe('doubleFields: the shapes match the engine objects, property for property', () => {
  const circuit = ladder([], { driverHigh: 40, driverLow: 25, loadResistance: 1e5 });
  const two = modalLadderOf(circuit, [1e3, 1e4], [1e-7, 1e-8]);
  const three = modalLadderOfAnyOrder(circuit, [1e3, 1e4, 1e5], [1e-7, 1e-8, 1e-9]);
  const state = periodicState(three, 0.3);
  const keys = (o: object) => Object.keys(o).join(',');
  // the shapes and the objects inside them (a phase curve in a state, the phase modes in a modal form)
  const inner = DOUBLE_FIELD_SHAPES.flatMap((o) => Object.values(o).filter((v) => typeof v === 'object' && !Array.isArray(v)));
  const shapes = [...DOUBLE_FIELD_SHAPES, ...inner].map(keys);
  it.each([
    ['phase curve', state.high],
    ['curve extrema', curveExtrema(state.high)],
    ['periodic state', state],
    ['small state', smallState(two, 0.3)],
    ['steady swing', steadySwing(two, 0.3)],
    ['steady error', steadyError(state)],
    ['modal form, one or two stages', two],
    ['modal form, any order', three],
    ['phase modes', three.hi],
  ])('%s', (_, o) => {
    expect(shapes).toContain(keys(o));
  });
});
