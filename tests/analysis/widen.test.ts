/**
 * The one domain-widening rule (analysis/widen.ts): points outside the diagram are answered on a
 * domain that holds them with 0.5 pH / 0.1 V to spare, by the probe verb and the report alike.
 */
import { describe, expect, it } from 'vitest';
import { probe } from '../../src/analysis/probe.js';
import { probeOperatingPoints } from '../../src/analysis/points.js';
import { computedHolding, holdsAll, pointComputer, widenedSpec } from '../../src/analysis/widen.js';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';

const spec = readSpec({ element: 'Fe', pH: [4, 10], E: [-1, 0.5] }, 'fe.yaml');

describe('domain widening', () => {
  it('holds points strictly inside only', () => {
    expect(holdsAll(spec, [{ pH: 7, E: 0 }])).toBe(true);
    expect(holdsAll(spec, [{ pH: 4, E: 0 }])).toBe(false);
    expect(holdsAll(spec, [{ pH: 7, E: 0.6 }])).toBe(false);
  });

  it('widens to every point with 0.5 pH and 0.1 V to spare, never narrows', () => {
    const s = widenedSpec(spec, [{ pH: 12, E: -1.3 }, { pH: 2, E: 0 }]);
    expect(s.pH).toEqual([1.5, 12.5]);
    expect(s.E[0]).toBeCloseTo(-1.4, 12);
    expect(s.E[1]).toBe(0.5);
    expect(widenedSpec(spec, [{ pH: 7, E: 0 }])).toEqual(spec);
  });

  it('gives the probe verb and the report the same answer outside the diagram', () => {
    const c = compute(readSpec({ element: 'Fe', pH: [4, 10], E: [-1, 0.5], points: [{ label: 'out', pH: 12, E: -0.3 }] }, 'fe.yaml'));
    const [fromReport] = probeOperatingPoints(c, []);
    const fromVerb = probe(pointComputer(c.spec)(c.spec.temperature, { pH: 12, E: -0.3 }), 12, -0.3);
    expect(fromReport.result).toEqual(fromVerb);
    // Outside the original frame the answer comes from the widened diagram, not a clipped one.
    expect(computedHolding(c, [{ pH: 12, E: -0.3 }]).spec.pH[1]).toBe(12.5);
    expect(fromVerb.distance.pH).not.toBeNull();
  });
});
