/**
 * What common LaTeX macros read as: Greek letters and relations, spacing, the unit and symbol
 * macros of astronomy journals (AASTeX, MNRAS, A&A: `\kms`, `\arcsec`, `\farcs`, `\degr`, `\sun`,
 * `\la`, `\ga`…), and siunitx unit macros. Macro names are without the backslash.
 * (Facts of the trade: these are the macros the journals' class files define; no source.)
 */

/** Macros that read as a fixed text, in text and math mode alike. */
export const SYMBOL_MACROS: Readonly<Record<string, string>> = {
  // Greek
  alpha: 'α', beta: 'β', gamma: 'γ', delta: 'δ', epsilon: 'ε', varepsilon: 'ε', zeta: 'ζ', eta: 'η', theta: 'θ', vartheta: 'θ',
  iota: 'ι', kappa: 'κ', lambda: 'λ', mu: 'μ', nu: 'ν', xi: 'ξ', pi: 'π', rho: 'ρ', sigma: 'σ', tau: 'τ', upsilon: 'υ',
  phi: 'φ', varphi: 'φ', chi: 'χ', psi: 'ψ', omega: 'ω',
  Gamma: 'Γ', Delta: 'Δ', Theta: 'Θ', Lambda: 'Λ', Xi: 'Ξ', Pi: 'Π', Sigma: 'Σ', Upsilon: 'Υ', Phi: 'Φ', Psi: 'Ψ', Omega: 'Ω',
  // Relations and operators
  sim: '∼', approx: '≈', simeq: '≃', sime: '≃', propto: '∝', equiv: '≡', neq: '≠', ne: '≠',
  le: '≤', leq: '≤', ge: '≥', geq: '≥', lt: '<', gt: '>', ll: '≪', gg: '≫',
  lesssim: '≲', gtrsim: '≳', la: '≲', ga: '≳', lapprox: '≲', gapprox: '≳', lower: '', ltsima: '≲', gtsima: '≳', lsim: '≲', gsim: '≳',
  times: '×', cdot: '·', pm: '±', mp: '∓', plusminus: '±', minus: '−', to: '→', rightarrow: '→', infty: '∞', sum: 'Σ', prime: '′',
  // Astronomy journal symbols
  odot: '⊙', sun: '⊙', earth: '⊕', arcsec: '″', arcmin: '′', arcdeg: '°', degr: '°', degree: '°', circ: '°',
  // Escapes and text symbols
  '%': '%', '&': '&', '$': '$', '#': '#', _: '_', '{': '{', '}': '}', textasciitilde: '~', textdegree: '°', textmu: 'μ',
  textpm: '±', texttimes: '×', textless: '<', textgreater: '>', S: '§', dag: '†', ddag: '‡', ldots: '…', dots: '…', cdots: '…',
  AA: 'Å', ang: 'Å', micron: 'μm', ell: 'ℓ', hbar: 'ħ',
  // Astronomy unit macros (AASTeX / MNRAS)
  kms: 'km s^-1', kmps: 'km s^-1', Msun: 'M⊙', Msol: 'M⊙', Lsun: 'L⊙', Mpc: 'Mpc', kpc: 'kpc', Gpc: 'Gpc',
  // Spacing
  ',': ' ', ';': ' ', ':': ' ', ' ': ' ', quad: ' ', qquad: ' ', enspace: ' ', thinspace: ' ', space: ' ', nobreakspace: ' ',
  '!': '', '/': '', '@': '', '-': '', noindent: '', centering: '', smallskip: ' ', medskip: ' ', bigskip: ' ', newline: ' ',
  left: '', right: '', big: '', Big: '', bigg: '', Bigg: '', displaystyle: '', textstyle: '', scriptstyle: '', limits: '', nolimits: '',
  protect: '', relax: '', hline: '', toprule: '', midrule: '', bottomrule: '', tableline: '', nodata: '', null: '', clearpage: '', newpage: '',
  maketitle: '', tablenotemark: '',
};

/** Macros whose single argument reads as itself (fonts, boxes, text in math). */
export const TRANSPARENT_ONE_ARG = new Set([
  'mathrm', 'text', 'textrm', 'textnormal', 'mbox', 'hbox', 'mathit', 'textit', 'emph', 'textbf', 'mathbf', 'bm', 'boldsymbol',
  'mathsf', 'textsf', 'mathtt', 'texttt', 'textsc', 'textup', 'textsl', 'mathcal', 'mathbb', 'operatorname', 'ensuremath',
  'underline', 'overline', 'widetilde', 'tilde', 'hat', 'widehat', 'bar', 'vec', 'dot', 'ddot', 'mathnormal', 'textmd', 'uppercase',
  'lowercase', 'MakeUppercase', 'MakeLowercase', 'fbox', 'footnotesize', 'small', 'scriptsize', 'tiny', 'large', 'Large', 'textsuperscript',
]);

/** Font switches without arguments (`{\rm m}`): read as nothing. */
export const FONT_SWITCHES = new Set(['rm', 'it', 'bf', 'sf', 'tt', 'sc', 'sl', 'em', 'cal', 'mit', 'normalfont', 'upshape', 'itshape', 'bfseries', 'rmfamily']);

/** Macros whose arguments are dropped entirely (references, labels, layout): name → number of mandatory arguments. */
export const DROPPED_WITH_ARGS: Readonly<Record<string, number>> = {
  label: 1, ref: 1, eqref: 1, autoref: 1, cref: 1, Cref: 1, pageref: 1, url: 1, vspace: 1, hspace: 1, 'vspace*': 1, 'hspace*': 1,
  includegraphics: 1, bibliographystyle: 1, bibliography: 1, usepackage: 1, documentclass: 1, RequirePackage: 1, setlength: 2,
  addtolength: 2, setcounter: 2, addtocounter: 2, graphicspath: 1, plotone: 1, plottwo: 2, epsscale: 1, figurenum: 1, tablenum: 1,
  phantom: 1, hphantom: 1, vphantom: 1, color: 1, definecolor: 3, orcid: 1, email: 1, affiliation: 1, altaffiliation: 1, keywords: 1,
  received: 1, accepted: 1, published: 1, submitjournal: 1, shorttitle: 1, shortauthors: 1, correspondingauthor: 1, author: 1,
  tablewidth: 1, decimals: 0, linenumbers: 0, nolinenumbers: 0, pagestyle: 1, thispagestyle: 1, bibitem: 1, newcounter: 1,
};

/** Citation macros: read as a citation marker that keeps the key (named parameter sets are cited). */
export const CITATION_MACROS = new Set(['cite', 'citep', 'citet', 'citealt', 'citealp', 'citeauthor', 'citeyear', 'citeyearpar', 'Citep', 'Citet', 'nocite', 'parencite', 'textcite', 'autocite']);

/** Sectioning commands: their title is a heading block. */
export const SECTION_MACROS = new Set(['part', 'chapter', 'section', 'subsection', 'subsubsection', 'paragraph', 'subparagraph', 'title', 'section*', 'subsection*', 'subsubsection*', 'chapter*']);

/** Environments whose content is skipped (verbatim-like, comments, code). */
export const SKIPPED_ENVIRONMENTS = new Set(['verbatim', 'verbatim*', 'Verbatim', 'lstlisting', 'minted', 'comment', 'alltt', 'filecontents', 'filecontents*', 'thebibliography', 'references']);

/** Display-math environments (and their starred forms). */
export const MATH_ENVIRONMENTS = new Set([
  'equation', 'equation*', 'align', 'align*', 'eqnarray', 'eqnarray*', 'gather', 'gather*', 'multline', 'multline*', 'flalign', 'flalign*',
  'alignat', 'alignat*', 'displaymath', 'math', 'split', 'subequations',
]);

/** Table environments: rows split at `\\`, cells at `&`. */
export const TABLE_ENVIRONMENTS = new Set(['tabular', 'tabular*', 'tabularx', 'longtable', 'deluxetable', 'deluxetable*', 'array', 'supertabular', 'splittabular']);

/** siunitx prefixes. */
export const SI_PREFIXES: Readonly<Record<string, string>> = {
  yocto: 'y', zepto: 'z', atto: 'a', femto: 'f', pico: 'p', nano: 'n', micro: 'μ', milli: 'm', centi: 'c', deci: 'd',
  deca: 'da', deka: 'da', hecto: 'h', kilo: 'k', mega: 'M', giga: 'G', tera: 'T', peta: 'P', exa: 'E',
};

/** siunitx units (and the astronomy ones authors declare with \DeclareSIUnit). */
export const SI_UNITS: Readonly<Record<string, string>> = {
  metre: 'm', meter: 'm', second: 's', gram: 'g', kelvin: 'K', kilogram: 'kg', parsec: 'pc', pc: 'pc', year: 'yr', yr: 'yr',
  lightyear: 'ly', astronomicalunit: 'au', au: 'au', arcsecond: 'arcsec', arcminute: 'arcmin', degree: 'deg', radian: 'rad',
  steradian: 'sr', electronvolt: 'eV', eV: 'eV', jansky: 'Jy', Jy: 'Jy', hertz: 'Hz', Hz: 'Hz', magnitude: 'mag', mag: 'mag',
  angstrom: 'Å', solarmass: 'M⊙', Msun: 'M⊙', Msol: 'M⊙', watt: 'W', joule: 'J', erg: 'erg', Mpc: 'Mpc', kpc: 'kpc', Gpc: 'Gpc',
  Gyr: 'Gyr', Myr: 'Myr', kyr: 'kyr', km: 'km', s: 's', m: 'm', K: 'K', g: 'g', cm: 'cm', percent: '%', hour: 'h', minute: 'min', day: 'd',
};
