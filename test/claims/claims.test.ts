/** Claim kinds and redshift binding, rule by rule. */
import { describe, expect, it } from 'vitest';
import { extractClaims, readLatex, readPlainText, type Claim } from '../../shared/src/index.js';

function claimsOf(src: string, plain = false): Array<{ kind: string; text: string; z: number | null; zSource: string | null; unchecked: string | null; claim: Claim }> {
  const doc = plain ? readPlainText(src) : readLatex(src);
  return extractClaims(doc).claims.map((c) => ({ kind: c.kind, text: doc.reading.text.slice(c.start, c.end), z: c.z, zSource: c.zSource, unchecked: c.unchecked, claim: c }));
}

describe('claim kinds', () => {
  it('tells distances apart by their names and symbols', () => {
    const c = claimsOf('At $z=1$ the luminosity distance is $D_L = 6.6$\\,Gpc, the angular-diameter distance $D_A = 1.65$\\,Gpc and the comoving distance 3.3\\,Gpc.');
    expect(c.map((x) => [x.kind, x.text])).toEqual([
      ['luminosityDistance', '6.6 Gpc'],
      ['angularDiameterDistance', '1.65 Gpc'],
      ['comovingDistance', '3.3 Gpc'],
    ]);
  });
  it('tells lookback time, age at z and age today apart', () => {
    const c = claimsOf('At $z = 1$ the light left 7.7\\,Gyr ago, when the universe was 5.8\\,Gyr old; today it is 13.5\\,Gyr old.');
    expect(c.map((x) => x.kind)).toEqual(['lookbackTime', 'age', 'ageToday']);
  });
  it('reads scales written as kpc/arcsec, and sizes stated for an angle', () => {
    const c = claimsOf('At $z = 0.5$ the scale is 6.1\\,kpc/arcsec, so 1\\farcs0 corresponds to 6.1\\,kpc and the 3\\farcs2 separation is 19.5\\,kpc.');
    expect(c.map((x) => [x.kind, x.claim.angleArcsec])).toEqual([['properScale', null], ['properScale', 1], ['properScale', 3.2]]);
  });
  it('reads epochs, the expansion factor and composition percentages', () => {
    const c = claimsOf('Equality was at $z_{\\rm eq} = 3400$ and recombination at $z_* \\approx 1090$. The universe has expanded a thousandfold since recombination. Today the universe is made of 5\\% baryons, 27\\% dark matter and 68\\% dark energy.');
    expect(c.map((x) => [x.kind, x.text, x.claim.parameter ?? x.claim.sinceEpoch])).toEqual([
      ['matterRadiationEquality', '3400', null],
      ['recombination', '1090', null],
      ['expansionFactor', 'thousandfold', 'recombination'],
      ['compositionPercentage', '5%', 'baryon'],
      ['compositionPercentage', '27%', 'dark matter'],
      ['compositionPercentage', '68%', 'dark energy'],
    ]);
  });
  it('reads the Hubble time and distance, h-scaled as in display equations', () => {
    const c = claimsOf('The Hubble time is \\[ 1/H_0 = 9.78\\times10^9\\,h^{-1}\\,{\\rm yr} \\] and the Hubble distance $c/H_0 = 2998\\,h^{-1}$\\,Mpc.');
    expect(c.map((x) => [x.kind, x.text, x.z])).toEqual([['hubbleTime', '9.78×10^9 h^-1 yr', null], ['hubbleDistance', '2998 h^-1 Mpc', null]]);
  });
  it('reads Hubble-law distances as their own kind, not as D_L', () => {
    expect(claimsOf('At $z = 0.01$ the Hubble-flow distance $cz/H_0 = 42.8$\\,Mpc.')[0].kind).toBe('hubbleLawDistance');
  });
  it('leaves alone numbers that are not claims', () => {
    const src = String.raw`In 2019 we observed 1250 stars (Figure~3, Section~4.2, Eq.~7) with a seeing of 0\farcs9, stellar masses of $10^{10}\,M_\odot$, the H$\alpha$ line at 656.3\,nm, $m_z = 25.3$\,mag in the $z$-band, 12 galaxies at $z > 2$, a parallax distance of 1.2\,kpc, apertures of 10\,kpc, $k = 0.1\,h$\,Mpc$^{-1}$, the strain $h_0 = 1.2\times10^{-25}$, a solid angle $\Omega = 2.1$\,deg$^2$ and a measured GW luminosity distance of $D_L = 440^{+180}_{-190}$\,Mpc from its posterior.`;
    expect(claimsOf(src)).toEqual([]);
  });
});

describe('binding to a redshift', () => {
  it('binds to the redshift of the sentence, of the clause, or in order with “respectively”', () => {
    expect(claimsOf('At $z = 2$ the age is 3.2\\,Gyr.')[0]).toMatchObject({ z: 2, zSource: 'sentence' });
    const r = claimsOf('The luminosity distances at $z = 0.3$ and 0.5 are 1.55 and 2.83\\,Gpc, respectively.');
    expect(r.map((x) => [x.text, x.z])).toEqual([['1.55', 0.3], ['2.83 Gpc', 0.5]]);
  });
  it('binds to the previous sentence, and to "this redshift"', () => {
    const c = claimsOf('The pair lies at $z = 1.27$. At this redshift the luminosity distance is 8.9\\,Gpc.');
    expect(c[0]).toMatchObject({ z: 1.27, zSource: 'previous-sentence' });
  });
  it('binds to a named object mentioned again later', () => {
    const c = claimsOf('The group Ember-3 lies at $z = 0.5$.\n\nIn a later section: the light left Ember-3 5.0\\,Gyr ago.');
    expect(c[0]).toMatchObject({ z: 0.5 });
  });
  it('binds table cells to the z column of their row and takes the unit from the header', () => {
    const c = claimsOf('\\begin{tabular}{lcc} Name & $z$ & $D_L$ (Mpc) \\\\ A & 0.5 & 2832 \\\\ \\end{tabular}');
    expect(c[0]).toMatchObject({ kind: 'luminosityDistance', text: '2832', z: 0.5, zSource: 'table-row' });
    expect(c[0].claim.value.unit?.unit).not.toBeNull();
  });
  it('binds table cells to the redshift in the table’s caption when the table has no z column', () => {
    const c = claimsOf('\\begin{table}\\caption{Distances of the pair at $z = 1.27$.}\\begin{tabular}{lc} Model & $D_A$ (Gpc) \\\\ round & 1.72 \\\\ \\end{tabular}\\end{table}');
    expect(c[0]).toMatchObject({ kind: 'angularDiameterDistance', text: '1.72', z: 1.27, zSource: 'caption' });
    const captionUnits = claimsOf('\\begin{table}\\caption{The pair at $z = 1.27$; distances in Gpc, times in Gyr.}\\begin{tabular}{lcc} Model & $D_A$ & $t_{\\rm lb}$ \\\\ round & 1.72 & 8.9 \\\\ \\end{tabular}\\end{table}');
    expect(captionUnits.map((x) => [x.kind, x.text, x.claim.value.unit?.text.trim(), x.z])).toEqual([['angularDiameterDistance', '1.72', 'Gpc', 1.27], ['lookbackTime', '8.9', 'Gyr', 1.27]]);
    const below = claimsOf('\\begin{table}\\begin{tabular}{lc} Model & $D_A$ (Gpc) \\\\ round & 1.72 \\\\ \\end{tabular}\\caption{Distances of the pair at $z = 1.27$.}\\end{table}');
    expect(below[0]).toMatchObject({ kind: 'angularDiameterDistance', text: '1.72', z: 1.27, zSource: 'caption' });
  });
  it('binds volumes to a range of redshift', () => {
    const c = claimsOf('The comoving volume between $z = 2$ and $z = 3$ is 120\\,Gpc$^3$, and within $1 < z < 2$ it is 430\\,Gpc$^3$.');
    expect(c[0].claim.zRange).toEqual([2, 3]);
  });
  it('leaves a claim unchecked, with the reason, when the binding is ambiguous or missing', () => {
    const ambiguous = claimsOf('Galaxies at $z = 1$ and quasars at $z = 2$ show distances near 8\\,Gpc for the luminosity distance.');
    expect(ambiguous[0].unchecked).toMatch(/names 2 redshifts/);
    const missing = claimsOf('The luminosity distance is 6.6\\,Gpc.');
    expect(missing[0].unchecked).toMatch(/no redshift/);
  });
  it('binds claims in the sentence of an epoch to the epoch’s redshift', () => {
    const c = claimsOf('Recombination happened at $z_* \\approx 1090$, when the universe was 372{,}000 years old and the CMB was at 2970\\,K.');
    expect(c.filter((x) => x.kind !== 'recombination').map((x) => [x.kind, x.z, x.zSource])).toEqual([['age', 1090, 'epoch'], ['cmbTemperature', 1090, 'epoch']]);
  });
  it('reads lookback statements spread over lines without the word lookback', () => {
    const c = claimsOf('From $z \\approx 2$ to the present,\nthe stars formed over\nthe last 10.2\\,Gyr.');
    expect(c[0]).toMatchObject({ kind: 'lookbackTime', z: 2 });
  });
  it('skips what the author silenced', () => {
    expect(claimsOf('% comove: skip-next-line\nAt $z = 1$ the age is 5.8\\,Gyr.')).toEqual([]);
  });
});

describe('notations seen in drafts', () => {
  const cases: Array<[string, Array<[string, string, number | null]>]> = [
    [String.raw`At $z\!=\!2$ the luminosity distance is $d_{\rm L}\simeq 15.5\,{\rm Gpc}$.`, [['luminosityDistance', '15.5 Gpc', 2]]],
    [String.raw`At $z = 1$, $D_{\rm A} = 1.65\,\mathrm{Gpc}$ and $D_\mathrm{L}=6.6\,\rm{Gpc}$.`, [['angularDiameterDistance', '1.65 Gpc', 1], ['luminosityDistance', '6.6 Gpc', 1]]],
    [String.raw`The lookback time to $z=0.5$ is $t_{\rm lb}\approx5.0$\,Gyr.`, [['lookbackTime', '5.0 Gyr', 0.5]]],
    [String.raw`At $z$\,=\,0.5 the age was $\sim$8.4~Gyr.`, [['age', '8.4 Gyr', 0.5]]],
    [String.raw`For $z = 3$, $1''$ corresponds to 7.7~kpc.`, [['properScale', '7.7 kpc', 3]]],
    [String.raw`At $z = 3$ the scale is 7.7\,kpc\,arcsec$^{-1}$ (proper).`, [['properScale', '7.7 kpc arcsec^-1', 3]]],
    [String.raw`The comoving volume to $z=2$ is $\approx 580\,h_{70}^{-3}$\,Gpc$^3$.`, [['comovingVolume', '580 h_70^-3 Gpc^3', 2]]],
    [String.raw`The Universe is 13.8~Gyr old, and at $z=6$ it was only $\sim 0.9$~Gyr old.`, [['ageToday', '13.8 Gyr', null], ['age', '0.9 Gyr', 6]]],
    [String.raw`at $z = 0.5$ ($D_L = 2.8$~Gpc; see Table~\ref{tab}) and at $z=1$ ($D_L = 6.6$~Gpc)`, [['luminosityDistance', '2.8 Gpc', 0.5], ['luminosityDistance', '6.6 Gpc', 1]]],
    [String.raw`At redshift two the luminosity distance is 15.8\,Gpc.`, [['luminosityDistance', '15.8 Gpc', 2]]],
    [String.raw`For an object at a redshift of about 1.9, $D_L = 14.6$\,Gpc.`, [['luminosityDistance', '14.6 Gpc', 1.9]]],
    [String.raw`The comoving volume of the field to $z = 3$ is 1.2\,Gpc$^3$. Its luminosity distance is 2.70\,Gpc.`, [['comovingVolume', '1.2 Gpc^3', 3], ['luminosityDistance', '2.70 Gpc', null]]],
  ];
  for (const [src, expected] of cases) {
    it(src, () => {
      expect(claimsOf(src).map((c) => [c.kind, c.text, c.z])).toEqual(expected);
    });
  }
});
