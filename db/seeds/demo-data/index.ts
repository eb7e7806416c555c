// Invented demo deposits for the seed (issue 4, item 7): physical but synthetic transport files of the fictional
// Meridian Transport Consortium's labs, each with a complete metadata record. Pure: no database, storage or clock.
import { blochGruneisenFilmDeposit } from './bloch-gruneisen-film';
import { hallSeriesDeposit } from './hall-series';
import { magnetoresistanceDeposit } from './magnetoresistance-sweep';
import { niobiumTransitionDeposit } from './niobium-transition';
import type { DemoDeposit } from './types';
import { vanDerPauwDeposit } from './van-der-pauw-film';

export type { DemoDeposit, DemoFile, DemoFileRole } from './types';

/** Every demo deposit, in a fixed order; the same bytes on every call (seeded noise). */
export function demoDeposits(): DemoDeposit[] {
  return [blochGruneisenFilmDeposit(), niobiumTransitionDeposit(), vanDerPauwDeposit(), hallSeriesDeposit(), magnetoresistanceDeposit()];
}
