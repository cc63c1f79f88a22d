/**
 * A synthetic LaTeX manuscript of any size for the reader benchmarks: an invented survey
 * paper's preamble, then sections of prose with inline and display math, author macros,
 * siunitx quantities, citations, footnotes, comments and tables, repeated with varying
 * numbers. Deterministic. The scenario is made up; the numbers are arbitrary, or (with
 * consistentValues) computed for the manuscript's declared set.
 */

import { computeQuantity, createCosmology } from '../../shared/src/index.js';

const PREAMBLE = String.raw`\documentclass[twocolumn]{aastex631}
\usepackage{siunitx}
\newcommand{\hMpc}{\,$h^{-1}$\,Mpc}
\newcommand{\kms}{\ifmmode{\rm km\,s^{-1}}\else km\,s$^{-1}$\fi}
\def\Om{\ensuremath{\Omega_{\rm m}}}
\newcommand{\lantern}{Lantern Deep Survey}
\newcommand{\zfield}[1]{$z_{\rm #1}$}
% comove: H0=70 Omega_m=0.3 flat
\begin{document}
\title{Star-forming pairs in the \lantern}
\begin{abstract}
We report on galaxy pairs found in the five fields of the \lantern\ at $0.1 < z < 6.5$.
\end{abstract}
`;

/**
 * The cosmology-dependent numbers of a section. By default they are arbitrary (nearly every claim
 * is then inconsistent: the worst case for the checker); `consistentValues` gives the ones a
 * flat ΛCDM set implies, as in a typical manuscript.
 */
export interface SectionValues {
  /** Luminosity distance (Mpc, integer), lookback time (Gyr, one decimal) and proper kpc per arcsec (one decimal) at z. */
  at(z: number, i: number): { d: string; t: string; scale: string };
  /** The comoving volume to z = 3 as siunitx arguments: number and unit. */
  volume(i: number): [string, string];
}

/** Values computed for the manuscript's own declaration (flat ΛCDM, H0 = 70, Ωm = 0.3), rounded as written. */
export function consistentValues(): SectionValues {
  const made = createCosmology({ H0: 70, Omega_m: 0.3, flat: true });
  if (!made.ok) throw new Error('the flat 70/0.3 set is valid');
  const c = made.cosmology;
  return {
    at: (z) => ({
      d: computeQuantity(c, 'luminosityDistance', z).toFixed(0),
      t: computeQuantity(c, 'lookbackTime', z).toFixed(1),
      scale: computeQuantity(c, 'properKpcPerArcsec', z).toFixed(1),
    }),
    volume: () => [computeQuantity(c, 'comovingVolume', 3).toPrecision(3), '\\giga\\parsec\\cubed'],
  };
}

const ARBITRARY: SectionValues = {
  at: (_z, i) => ({ d: (1000 + ((i * 373) % 9000)).toFixed(0), t: (2 + ((i * 7) % 100) / 10).toFixed(1), scale: (5 + (i % 40) / 10).toFixed(1) }),
  volume: (i) => [`${(i % 9) + 1}.2e5`, '\\mega\\parsec\\cubed'],
};

function section(i: number, values: SectionValues): string {
  const z = (0.3 + (i % 37) * 0.11).toFixed(2);
  const { d, t, scale } = values.at(Number(z), i);
  const b = values.at(1.274, i);
  const c = values.at(2.93, i);
  return String.raw`
\section{Field ${i}: photometry and redshifts}\label{sec:field${i}}
We adopt a flat $\Lambda$CDM cosmology with $H_0 = 70$\,\kms\,Mpc$^{-1}$ and \Om$=0.3$
\citep{survey${i % 9}}. The brightest pair lies at $z = ${z}$, where the luminosity distance is
$D_L \approx ${d}$\,Mpc and 1\farcs0 corresponds to ${scale}\,kpc; the light
left it about ${t}\,Gyr ago.\footnote{Magnitudes are in the AB system; see Section~\ref{sec:field${i}}.}
Its stellar mass is $\log(M_\star/M_\odot) = ${(9 + (i % 20) / 10).toFixed(1)} \pm 0.2$ % measured with our own code
and the comoving volume of the field to $z = 3$ is \SI{${values.volume(i)[0]}}{${values.volume(i)[1]}}.
Equation~(\ref{eq:dl${i}}) gives the distance used throughout:
\begin{equation}\label{eq:dl${i}}
  D_L(z) = (1+z)\,\frac{c}{H_0}\int_0^z \frac{dz'}{E(z')} \simeq ${d}\,{\rm Mpc}.
\end{equation}

\begin{deluxetable}{lccc}
\tablecaption{Targets in field ${i}\label{tab:f${i}}}
\tablehead{\colhead{Name} & \colhead{$z$} & \colhead{$D_L$ (Mpc)} & \colhead{$t_{\rm lb}$ (Gyr)}}
\startdata
L${i}-a & ${z} & ${d} & ${t} \\
L${i}-b & 1.274 & ${b.d} & ${b.t} \\
L${i}-c & 2.93 & ${c.d} & ${c.t} \\
\enddata
\end{deluxetable}

Across the \lantern\ we find ${12 + (i % 30)} pairs at $z > 2$ with separations below 30\hMpc, measured in the
$z$-band to $m_z < 25.3$ mag (see Fig.~${(i % 7) + 1} and Table~\ref{tab:f${i}}).
`;
}

/** A manuscript of at least `bytes` characters. */
export function syntheticLatexManuscript(bytes: number, values: SectionValues = ARBITRARY): string {
  let out = PREAMBLE;
  for (let i = 0; out.length < bytes; i++) out += section(i, values);
  return out + '\n\\end{document}\n';
}

function markdownSection(i: number): string {
  const z = (0.3 + (i % 37) * 0.11).toFixed(2);
  const d = (1000 + ((i * 373) % 9000)).toFixed(0);
  const t = (2 + ((i * 7) % 100) / 10).toFixed(1);
  return `
## Field ${i}: targets

The brightest pair lies at $z = ${z}$, where the luminosity distance is $D_L \\approx ${d}$ Mpc and
one arcsecond corresponds to ${(5 + (i % 40) / 10).toFixed(1)} kpc; the light left it about **${t} Gyr** ago.
We request ${3 + (i % 5)} hours (run \`L${i}\`) with a seeing better than 0.8″.${i % 25 === 0 ? `[^f${i}]` : ''}

| Target | $z$ | $D_L$ (Mpc) | lookback time (Gyr) |
|--------|-----|-------------|---------------------|
| L${i}-a | ${z} | ${d} | ${t} |
| L${i}-b | 1.274 | 9154 | 8.9 |

$$
D_L(z) = (1+z)\\,\\frac{c}{H_0}\\int_0^z \\frac{dz'}{E(z')}
$$

${i % 25 === 0 ? `[^f${i}]: Magnitudes are AB; ${12 + (i % 30)} pairs lie at $z > 2$.` : `Magnitudes are AB; ${12 + (i % 30)} pairs lie at $z > 2$.`}
`;
}

/** A Markdown proposal of at least `bytes` characters. */
export function syntheticMarkdownManuscript(bytes: number): string {
  let out = '---\ntitle: Lantern follow-up\ncosmology: H0=70 Omega_m=0.3 flat\n---\n\n# Science case\n';
  for (let i = 0; out.length < bytes; i++) out += markdownSection(i);
  return out;
}
