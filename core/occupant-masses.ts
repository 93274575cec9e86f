/**
 * Mass per occupant that inspection and approval regimes use, as data with its source. The user
 * chooses one in `build_up.occupant.basis` (or "custom" with their own figure); nothing is defaulted.
 */
import { TO_SI } from './units.ts';
import { coreErrors } from './errors.ts';

export interface OccupantMass {
  id: string;
  mass_kg: number;
  /** Where and how the figure is used. */
  use: string;
  source: string;
}

export const OCCUPANT_MASSES = [
  {
    id: 'eu-75',
    mass_kg: 75,
    use: 'EU type approval: the mass in running order includes a 75 kg driver',
    source: 'Regulation (EU) No 1230/2012, Art. 2, mass in running order (from memory)',
  },
  {
    id: 'au-nsw-68',
    mass_kg: 68,
    use: 'NSW (Australia) brake assessment: 68 kg in every unoccupied seat for the maximum loaded test mass',
    source: 'NSW (Australia) RMS "Brake assessment manual" v1.0 (2013), definition of the maximum loaded test mass (MLTM)',
  },
  {
    id: 'uk-mot-63.5',
    mass_kg: 63.5,
    use: 'UK MOT class 5 test weight: 63.5 kg (140 lb) per passenger seat',
    source: 'UK MOT testing guide, class 5 brake test weight, http://www.motinfo.gov.uk/htdocs/m4s03000802.htm',
  },
  {
    id: 'us-154-lb',
    mass_kg: 154 * TO_SI.lb,
    use: 'United States: 154 lb (69.85 kg) per designated seating or sleeping position',
    source: '49 CFR 571.110 (FMVSS 110), from memory; 154 lb per sleeping position as practitioners report it, no published source read',
  },
] as const satisfies readonly OccupantMass[];

/** The ids of OCCUPANT_MASSES, and `custom`. */
export const OCCUPANT_BASES = ['eu-75', 'au-nsw-68', 'uk-mot-63.5', 'us-154-lb', 'custom'] as const;
export type OccupantBasis = (typeof OCCUPANT_BASES)[number];

/** The occupant mass of a basis, kg; `custom` takes the user's figure. */
export function occupantMass(basis: OccupantBasis, customKg?: number): number {
  if (basis === 'custom') {
    if (customKg === undefined) throw coreErrors.occupantMass();
    return customKg;
  }
  return OCCUPANT_MASSES.find((o) => o.id === basis)!.mass_kg;
}
