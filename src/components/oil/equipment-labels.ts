import type { equipmentKinds } from '@contracts/oil.js';

export const kindLabels: Record<(typeof equipmentKinds)[number], string> = {
  'belt-skimmer': 'Belt skimmer',
  'drum-skimmer': 'Drum skimmer',
  'disc-skimmer': 'Disc skimmer',
  'tube-skimmer': 'Tube skimmer',
  'mop-skimmer': 'Mop skimmer',
  'oil-water-separator': 'Oil-water separator',
  sump: 'Sump',
};
