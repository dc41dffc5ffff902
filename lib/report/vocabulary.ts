/** Our words for the mapping's mechanisms, routes and likelihoods, as the report prints them. */
import type { ExposureRoute, LikelihoodClass, Mechanism } from '../exposure/types';

export const MECHANISM_LABEL: Record<Mechanism | 'transient', string> = {
  neighbour: 'Neighbour',
  stacked: 'Stacked level',
  'same-cable': 'Same cable',
  'look-alike': 'Look-alike',
  bridge: 'Bridge',
  transient: 'Surge / ESD',
};

export const ROUTE_LABEL: Record<ExposureRoute, string> = {
  adjacent: 'next position',
  near: '2–3 positions away',
  'other-level': 'another level of the block',
  'cable-core': 'another core of the cable',
  'connector-pin': 'another pin of the connector',
  'terminal-number': 'same terminal number on another strip',
  'wire-number-same': 'identical wire number',
  'wire-number-similar': 'wire number one slip away',
  'bridge-member': 'jumpered into the group',
  'bridge-span': 'a bridge passes over it',
  'bridge-end': 'a bridge one tooth off',
};

export const LIKELIHOOD_LABEL: Record<LikelihoodClass, string> = {
  likely: 'Likely',
  plausible: 'Plausible',
  remote: 'Remote',
};
