/** The LaTeX reader: reading text, structure, source offsets, and bad input. */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readLatex } from '../../shared/src/reader/latexScanner.js';

/** The reading text of a one-block source. */
function text(src: string): string {
  return readLatex(src).reading.text.trim();
}

/** The source text behind the first occurrence of `needle` in the reading text. */
function sourceOf(src: string, needle: string): string {
  const r = readLatex(src);
  const i = r.reading.text.indexOf(needle);
  if (i < 0) throw new Error(`'${needle}' not in ${JSON.stringify(r.reading.text)}`);
  const { start, end } = r.reading.sourceRange(i, i + needle.length);
  return src.slice(start, end);
}

describe('reading text', () => {
  it('reads inline math, spacing and units as a person would', () => {
    expect(text(String.raw`$H_0 = 70$\,km\,s$^{-1}$\,Mpc$^{-1}$ and $\Omega_{\rm m}=0.3$`)).toBe('H_0 = 70 km s^-1 Mpc^-1 and Ω_m=0.3');
    expect(text(String.raw`${'{\\Omega}'}_{\rm \Lambda} \approx 0.7`)).toBe('Ω_Λ ≈ 0.7');
    expect(text(String.raw`$1.2\times10^{28}$\,cm, $z\la 2$, $z\ga 6$, $\sim 3$\,Gyr`)).toBe('1.2×10^28 cm, z≲ 2, z≳ 6, ∼ 3 Gyr');
    expect(text(String.raw`$D_L = 8.3^{+0.1}_{-0.2}$\,Gpc`)).toBe('D_L = 8.3^+0.1_-0.2 Gpc');
    expect(text('pages 10--20 and a---b')).toBe('pages 10–20 and a—b');
  });

  it('expands the author’s macros: \\newcommand with and without arguments, optional defaults, \\def, \\DeclareMathOperator', () => {
    const src = String.raw`\newcommand{\hMpc}{\,$h^{-1}$\,Mpc}
\newcommand{\zz}[2][1.0]{z=#1 and #2}
\def\Om{\ensuremath{\Omega_{\rm m}}}
\def\pair#1#2{(#1, #2)}
\DeclareMathOperator{\Ho}{H_0}
\begin{document}
100\hMpc\ boxes; \zz{x}; \zz[2.5]{y}; \Om=0.3; \pair{0.3}{0.7}; $\Ho=70$
\end{document}`;
    expect(text(src)).toBe('100 h^-1 Mpc boxes; z=1.0 and x; z=2.5 and y; Ω_m=0.3; (0.3, 0.7); H_0=70');
  });

  it('chooses the \\ifmmode branch by mode, as unit macros of the journals need', () => {
    const src = String.raw`\newcommand{\kms}{\ifmmode{\rm km\,s^{-1}}\else km\,s$^{-1}$\fi}
\begin{document}70\,\kms\ and $70\,\kms$\end{document}`;
    expect(text(src)).toBe('70 km s^-1 and 70 km s^-1');
  });

  it('knows the journals’ symbol macros and siunitx', () => {
    expect(text(String.raw`1\farcs5 and 3\farcm2 and 10\degr`)).toBe('1.5″ and 3.2′ and 10°');
    expect(text(String.raw`\SI{6.6}{\giga\parsec}, \qty{1.2e3}{\mega\parsec\cubed}, \si{\kilo\metre\per\second\per\mega\parsec}`)).toBe('6.6 Gpc, 1.2×10^3 Mpc^3, km s^-1 Mpc^-1');
    expect(text(String.raw`\SIrange{9}{11}{\giga\year} and \num{3e4}`)).toBe('9–11 Gyr and 3×10^4');
    expect(text(String.raw`$10^{12}\,M_\odot$ and $M_{\sun}$`)).toBe('10^12 M_⊙ and M_⊙');
  });

  it('keeps citation keys (named parameter sets are cited) and drops references and labels', () => {
    expect(text(String.raw`as in \citet[][]{planck2018vi}, Eq.~(\ref{eq:dl})\label{x}`)).toBe('as in ⟦cite:planck2018vi⟧, Eq. ()');
  });

  it('marks values injected at build time', () => {
    expect(text(String.raw`$H_0 = \variable{output/h0.txt}$`)).toBe('H_0 = ⟦value⟧');
  });

  it('skips comments (not \\%), verbatim and the preamble', () => {
    const src = String.raw`\documentclass{article}
\title{ignored}
\begin{document}
a 5\% rise % not this
b \verb|$x$| c
\begin{verbatim}
D_L = 99 Gpc
\end{verbatim}
\end{document}
after the end`;
    expect(text(src)).toBe('a 5% rise b c');
  });
});

describe('structure', () => {
  const src = String.raw`\begin{document}
\section{Distances}
At $z=1.2$ the distance is 8.3\,Gpc.\footnote{With \citet{other}.} Next sentence.

\begin{table}
\caption{Targets.}
\begin{tabular}{lcc}
\hline
Name & $z$ & $D_L$ (Mpc) \\
\hline
A & 0.5 & 2832 \\
B & 1.0 & 6607 \\
\end{tabular}
\end{table}
\begin{deluxetable}{lc}
\tablehead{\colhead{Field} & \colhead{$t_{\rm lb}$ (Gyr)}}
\startdata
F1 & 5.0 \\
\enddata
\end{deluxetable}
\begin{equation}
t_0 = 13.5\,{\rm Gyr}
\end{equation}
\end{document}`;
  const r = readLatex(src);
  const blockTexts = r.blocks.map((b) => [b.kind, r.reading.text.slice(b.start, b.end)]);

  it('makes headings, paragraphs, footnotes and captions into blocks, footnotes after their paragraph', () => {
    expect(blockTexts.slice(0, 4)).toEqual([
      ['heading', 'Distances'],
      ['paragraph', 'At z=1.2 the distance is 8.3 Gpc. Next sentence.'],
      ['footnote', 'With ⟦cite:other⟧.'],
      ['caption', 'Targets.'],
    ]);
  });

  it('gives table cells their row, column and the header of their column', () => {
    const cells = r.blocks.filter((b) => b.kind === 'table-cell').map((b) => ({ text: r.reading.text.slice(b.start, b.end), ...b.cell }));
    expect(cells).toContainEqual({ text: '2832', table: 0, row: 1, column: 2, header: 'D_L (Mpc)' });
    expect(cells).toContainEqual({ text: '1.0', table: 0, row: 2, column: 1, header: 'z' });
    expect(cells).toContainEqual({ text: '5.0', table: 1, row: 0, column: 1, header: 't_lb (Gyr)' });
  });

  it('records math spans, inline and display', () => {
    const spans = r.math.map((m) => [r.reading.text.slice(m.start, m.end), m.display]);
    expect(spans).toContainEqual(['z=1.2', false]);
    expect(spans).toContainEqual(['t_0 = 13.5 Gyr', true]);
  });

  it('splits sentences without breaking on abbreviations or decimals', () => {
    const sentences = r.sentences.map((s) => r.reading.text.slice(s.start, s.end));
    expect(sentences).toContain('At z=1.2 the distance is 8.3 Gpc.');
    expect(sentences).toContain('Next sentence.');
    const other = readLatex('We follow Smith et al. (2020), i.e. the usual one. Then Fig. 3 shows it at z = 0.5. Done.');
    expect(other.sentences.map((s) => other.reading.text.slice(s.start, s.end))).toEqual([
      'We follow Smith et al. (2020), i.e. the usual one.',
      'Then Fig. 3 shows it at z = 0.5.',
      'Done.',
    ]);
  });

  it('finds directives, included files and the TeX root', () => {
    const multi = readLatex('% !TEX root = ../thesis.tex\n% comove: planck-2018\nText.\n\\input{chapters/intro}\n\\include{results.tex}\n% comove: skip-next-line\n');
    expect(multi.texRoot).toBe('../thesis.tex');
    expect(multi.directives.map((d) => d.text)).toEqual(['planck-2018', 'skip-next-line']);
    expect(multi.includes.map((i) => [i.command, i.path])).toEqual([['input', 'chapters/intro'], ['include', 'results.tex']]);
  });
});

describe('source offsets', () => {
  it('map verbatim text back character by character, and expansions to the macro that made them', () => {
    const src = String.raw`\newcommand{\hMpc}{\,$h^{-1}$\,Mpc}\begin{document}The value $D_L = 8.3$\,Gpc at 100\hMpc.\end{document}`;
    expect(sourceOf(src, '8.3')).toBe('8.3');
    expect(sourceOf(src, 'D_L')).toBe('D_L');
    expect(sourceOf(src, 'h^-1 Mpc')).toBe('\\hMpc');
    expect(sourceOf(src, 'Gpc')).toBe('Gpc');
  });
});

describe('bad input', () => {
  it('reports unbalanced math at its opening, and still reads the rest', () => {
    const r = readLatex('Text $x = 3 and more\n\nNext paragraph $y=2$.');
    expect(r.problems.some((p) => p.message.includes('unbalanced math') && p.sourceStart === 5)).toBe(true);
    expect(r.reading.text).toContain('Next paragraph y=2.');
  });
  it('reports unbalanced braces and unclosed environments', () => {
    expect(readLatex('a {b c').problems.some((p) => /unbalanced braces/.test(p.message))).toBe(true);
    expect(readLatex('a } b').problems.some((p) => /closes nothing/.test(p.message))).toBe(true);
    expect(readLatex('\\begin{itemize} x').problems.some((p) => /not closed/.test(p.message))).toBe(true);
  });
  it('stops a runaway recursive macro with a problem instead of hanging', () => {
    const r = readLatex('\\def\\loop{a\\loop}\\loop');
    expect(r.problems.some((p) => /too deep/.test(p.message))).toBe(true);
  });
  it('never throws, and every reading offset maps inside the source (property)', () => {
    const latexish = fc.array(
      fc.constantFrom('\\', '{', '}', '$', '$$', '%', '&', '~', '\n', '\n\n', '^', '_', '-', 'a', '1.5', ' ', '\\begin{tabular}', '\\end{tabular}', '\\\\',
        '\\newcommand{\\x}[1]{#1#1}', '\\x{y}', '\\def\\y{\\y}', '\\y', '\\footnote{', '\\SI{1}{\\mega\\parsec}', '\\ifmmode', '\\else', '\\fi', '\\(', '\\)', '\\[', '\\]',
        '\\begin{equation}', '\\end{equation}', '\\verb|', '\\cite{k}', '\\farcs', 'é', '\u0000'),
      { maxLength: 60 },
    ).map((parts) => parts.join(''));
    fc.assert(
      fc.property(fc.oneof(latexish, fc.string({ maxLength: 200 })), (src) => {
        const r = readLatex(src);
        const t = r.reading.text;
        for (let i = 0; i < t.length; i += 7) {
          const { start, end } = r.reading.sourceRange(i, i + 1);
          expect(start).toBeGreaterThanOrEqual(0);
          expect(end).toBeLessThanOrEqual(src.length);
          expect(start).toBeLessThanOrEqual(end);
        }
        for (const b of r.blocks) expect(b.end).toBeLessThanOrEqual(t.length);
      }),
      { numRuns: 300 },
    );
  });
  it('maps every digit of the reading text that was copied verbatim to the same digit in the source (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom('We', ' ', 'z=', '1.25', '$', '\\,', 'Mpc', '\\%', '~', '\n', '{', '}', '42'), { maxLength: 40 }), (parts) => {
        const src = parts.join('');
        const r = readLatex(src);
        const t = r.reading.text;
        for (let i = 0; i < t.length; i++) {
          if (!/[0-9]/.test(t[i])) continue;
          const { start, end } = r.reading.sourceRange(i, i + 1);
          if (end - start === 1) expect(src[start]).toBe(t[i]);
        }
      }),
      { numRuns: 300 },
    );
  });
});
