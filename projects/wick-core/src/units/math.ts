import { all, create } from 'mathjs';

/**
 * The units module's private mathjs instance. Never exported from the library: the units we add
 * here must not leak into anybody else's mathjs.
 *
 * Units mathjs 15 lacks, with their definitions:
 * - poise P = 0.1 Pa·s (so cP = 1 mPa·s) — CGS definition, BIPM SI Brochure 8th ed. (2006) Table 9.
 * - stokes St = 1 cm²/s (so cSt = 1 mm²/s) — same table.
 * - tex = 1 g/km (dtex = 1 g/10 km); denier = 1 g/9 km = 1/9 tex — ISO 1144 / textile practice.
 * - gsm = 1 g/m² — common practice for nonwoven basis weight.
 * - darcy = 1 cP·cm²/(s·atm) = 1e-7/101325 m² ≈ 9.869233e-13 m² — Darcy unit as defined by
 *   Wyckoff, Botset, Muskat & Reed (1933); atm = 101325 Pa exactly.
 * - micron = 1 µm (old name still used on fibre datasheets).
 * - percent = 0.01 (the parser rewrites % and %RH to it).
 */
export const math = create(all);

const ATM_PA = 101325;
/** 1 darcy in m², from its definition 1 cP · 1 cm² / (1 s · 1 atm). */
export const DARCY_M2 = (1e-3 * 1e-4) / ATM_PA;

math.createUnit(
  {
    P: { definition: '0.1 Pa s', prefixes: 'short' },
    poise: { definition: '0.1 Pa s', prefixes: 'long' },
    St: { definition: '1 cm^2/s', prefixes: 'short' },
    stokes: { definition: '1 cm^2/s', prefixes: 'long' },
    tex: { definition: '1 g/km', prefixes: 'short' },
    // 1 den = 1/9 tex exactly; defined from g/km because createUnit reads all definitions first.
    denier: { definition: math.unit(1 / 9, 'g/km'), aliases: ['den', 'deniers'] },
    gsm: { definition: '1 g/m^2' },
    darcy: { definition: math.unit(DARCY_M2, 'm^2'), prefixes: 'long', aliases: ['darcys', 'darcies'] },
    D: { definition: math.unit(DARCY_M2, 'm^2'), prefixes: 'short' },
    micron: { definition: '1 um', aliases: ['microns'] },
    percent: { definition: math.unit(0.01, 'm/m') },
  },
  { override: false },
);
