/**
 * A student's variant and the exercise's model in words and numbers, for the
 * template's cover sheet and the student's exercise list. Parameters only:
 * nothing here computes or reveals a reference value.
 */
import { huckelChain, huckelGraph, huckelRing, parseHuckelGraph } from '@shared/chemistry/huckel';
import type { DistanceUnit, EnergyUnit } from '@shared/chemistry/units';
import type { ExerciseSpec, HuckelSystem, ModelSpec } from '@shared/exercises/spec';
import { huckelSystemLabel, type Variant } from '@shared/exercises/variants';
import type { VariantSummary } from '@shared/api/templates';

const number = (x: number) => String(Math.round(x * 1e10) / 1e10);

export interface PiSystemCounts {
  atomCount: number;
  electronCount: number;
  charge: number;
  /** atom types other than plain carbon, e.g. ["N-pyridine"] */
  heteroatomTypes: string[];
}

/** Size of a pi system (atoms, pi electrons, charge) — counts only, no energies. */
export function piSystemCounts(system: HuckelSystem): PiSystemCounts {
  const result =
    system.kind === 'chain' ? huckelChain(system.n) : system.kind === 'ring' ? huckelRing(system.n) : huckelGraph({ ...parseHuckelGraph(system.graph), name: system.name });
  const heteroatomTypes = [...new Set(result.atoms.map((a) => a.type).filter((t) => t !== 'C'))];
  return { atomCount: result.atomCount, electronCount: result.electronCount, charge: result.charge, heteroatomTypes };
}

/** The variant as { key, text, parameters } for lists and the cover sheet. */
export function variantSummary(variant: Variant): VariantSummary {
  switch (variant.family) {
    case 'one-electron': {
      const zeta = variant.zeta === 'optimized' ? 'optimized at each R' : number(variant.zeta);
      const parameters = [
        { name: 'Za', value: number(variant.za) },
        { name: 'Zb', value: number(variant.zb) },
        { name: 'ζ', value: zeta },
      ];
      return { key: variant.key, text: parameters.map((p) => `${p.name} = ${p.value}`).join(', '), parameters };
    }
    case 'two-electron': {
      const zeta = variant.zeta === 'optimized' ? 'optimized at each R' : number(variant.zeta);
      return { key: variant.key, text: `ζ = ${zeta}`, parameters: [{ name: 'ζ', value: zeta }] };
    }
    case 'diatomic':
      return { key: variant.key, text: variant.species, parameters: [{ name: 'species', value: variant.species }] };
    case 'huckel': {
      const label = huckelSystemLabel(variant.system);
      return { key: variant.key, text: label, parameters: [{ name: 'pi system', value: label }] };
    }
  }
}

/** What the model is, in one line. */
export function modelText(model: ModelSpec): string {
  switch (model.family) {
    case 'one-electron':
      return model.method === 'lcao'
        ? 'One electron, two nuclei: minimal LCAO with 1s Slater orbitals'
        : 'One electron, two nuclei: exact (Born–Oppenheimer) energies';
    case 'two-electron':
      return {
        mo: 'Two electrons (H2), minimal 1s basis: simple MO',
        ci: 'Two electrons (H2), minimal 1s basis: MO with configuration interaction',
        vb: 'Two electrons (H2), minimal 1s basis: valence bond (Heitler–London)',
      }[model.method];
    case 'diatomic':
      return `MO diagram of a diatomic molecule (level order: ${{ auto: 'the usual one for the species', mixed: 'with s–p mixing', unmixed: 'without s–p mixing' }[model.order]})`;
    case 'huckel':
      return 'Hückel pi-electron theory (E = α + xβ)';
  }
}

export const distanceUnitWords: Record<DistanceUnit, string> = { bohr: 'bohr (a0)', angstrom: 'ångström (Å)', pm: 'picometre (pm)' };
/** header spellings the report reader recognises (shared/marking/read/header-words.ts) */
export const distanceUnitHeader: Record<DistanceUnit, string> = { bohr: 'bohr', angstrom: 'Å', pm: 'pm' };
export const energyUnitWords: Record<EnergyUnit, string> = {
  hartree: 'hartree (Eh)',
  ev: 'electronvolt (eV)',
  'kj/mol': 'kilojoule per mole (kJ/mol)',
  'kcal/mol': 'kilocalorie per mole (kcal/mol)',
  'cm-1': 'wavenumber (cm-1)',
};
export const energyUnitHeader: Record<EnergyUnit, string> = { hartree: 'Eh', ev: 'eV', 'kj/mol': 'kJ/mol', 'kcal/mol': 'kcal/mol', 'cm-1': 'cm-1' };

/**
 * The energy unit a template asks for. The exercise spec names the distance
 * unit of its grid but no energy unit, so templates ask for hartree, the
 * engine's own unit.
 */
export function templateEnergyUnit(_spec: ExerciseSpec): EnergyUnit {
  return 'hartree';
}

/** "10% off per started day late after 15 minutes' grace, at most 50%." */
export function lateRuleSummary(late: ExerciseSpec['late']): string {
  if (late.penaltyPerDayPercent === 0 || late.capPercent === 0) {
    return late.graceMinutes > 0 ? `Late uploads are accepted without penalty (${graceText(late.graceMinutes)} grace).` : 'Late uploads are accepted without penalty.';
  }
  const grace = late.graceMinutes > 0 ? ` after ${graceText(late.graceMinutes)} grace` : '';
  const cap = late.capPercent >= 100 ? 'up to the whole mark' : `at most ${number(late.capPercent)}%`;
  return `${number(late.penaltyPerDayPercent)}% off per started day late${grace}, ${cap}.`;
}

function graceText(minutes: number): string {
  if (minutes % 1440 === 0) return `${minutes / 1440} ${minutes === 1440 ? "day's" : "days'"}`;
  if (minutes % 60 === 0) return `${minutes / 60} ${minutes === 60 ? "hour's" : "hours'"}`;
  return `${minutes} ${minutes === 1 ? "minute's" : "minutes'"}`;
}
