/**
 * Data for charts of a document's claims: for each family of quantities (distances, times,
 * scales) the model curves of the kinds the document states, sampled in z, and the stated values
 * placed on them in the same unit. The reports and the editor's chart draw from this.
 */

import type { ClaimKind } from '../claims/claimKinds.js';
import type { Cosmology } from '../cosmology/cosmology.js';
import { computeQuantity } from '../cosmology/quantities.js';
import type { ClaimCheck, Verdict } from './checker.js';
import { kindTitle } from './explain.js';

export interface ChartSeries {
  readonly kind: ClaimKind;
  readonly label: string;
  readonly points: ReadonlyArray<readonly [number, number]>;
}

export interface ChartPoint {
  readonly kind: ClaimKind;
  readonly z: number;
  /** Stated value in the chart's unit. */
  readonly stated: number;
  readonly computed: number;
  readonly status: Verdict;
  /** Index of the claim in the file's checks. */
  readonly index: number;
}

export interface Chart {
  readonly title: string;
  readonly unit: string;
  readonly logarithmic: boolean;
  readonly zMax: number;
  readonly series: readonly ChartSeries[];
  readonly points: readonly ChartPoint[];
}

const FAMILIES: ReadonlyArray<{ title: string; unit: string; logarithmic: boolean; kinds: ReadonlyArray<[ClaimKind, string]> }> = [
  {
    title: 'Distances', unit: 'Mpc', logarithmic: true,
    kinds: [['luminosityDistance', 'luminosityDistance'], ['angularDiameterDistance', 'angularDiameterDistance'], ['comovingDistance', 'comovingDistance'], ['transverseComovingDistance', 'transverseComovingDistance'], ['lightTravelDistance', 'lightTravelDistance']],
  },
  { title: 'Times', unit: 'Gyr', logarithmic: false, kinds: [['lookbackTime', 'lookbackTime'], ['age', 'age']] },
  { title: 'Angular scales', unit: 'kpc/arcsec', logarithmic: false, kinds: [['properScale', 'properKpcPerArcsec'], ['comovingScale', 'comovingKpcPerArcsec']] },
];

const SAMPLES = 160;

/** Charts of the checks that `include` admits (those made under cosmology c); points keep their index in `checks`. */
export function chartData(checks: readonly ClaimCheck[], c: Cosmology, include: (check: ClaimCheck) => boolean = () => true): Chart[] {
  const charts: Chart[] = [];
  for (const family of FAMILIES) {
    const quantityOf = new Map(family.kinds);
    const points: ChartPoint[] = [];
    checks.forEach((check, index) => {
      const claim = check.claim;
      const key = quantityOf.get(claim.kind);
      if (!key || !include(check) || claim.z === null || check.computed === null || check.computed === 0 || claim.angleArcsec !== null || check.status === 'unchecked') return;
      // The stated value in the chart's unit: scaled like the computed value (this carries any h-scaling or unit of the claim).
      const base = computeQuantity(c, key, claim.z);
      points.push({ kind: claim.kind, z: claim.z, stated: claim.value.value * (base / check.computed), computed: base, status: check.status, index });
    });
    if (points.length === 0) continue;
    const zMax = Math.max(1, 1.1 * Math.max(...points.map((p) => p.z)));
    const kinds = [...new Set(points.map((p) => p.kind))];
    const series = kinds.map((kind) => {
      const key = quantityOf.get(kind)!;
      const pts: Array<[number, number]> = [];
      for (let i = 0; i <= SAMPLES; i++) {
        const z = family.logarithmic ? Math.max(1e-3, (zMax * i) / SAMPLES) : (zMax * i) / SAMPLES;
        pts.push([z, computeQuantity(c, key, z)]);
      }
      return { kind, label: kindTitle(kind), points: pts };
    });
    charts.push({ title: family.title, unit: family.unit, logarithmic: family.logarithmic, zMax, series, points });
  }
  return charts;
}
