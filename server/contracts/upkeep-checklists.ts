import type { equipmentKinds } from './oil.js';

type Kind = (typeof equipmentKinds)[number];
export interface UpkeepItem {
  key: string;
  label: string;
}

// Common practice, no published source: what a person looks at on each kind of equipment at a
// routine check. The equipment maker's manual adds to these and governs.
const drive = { key: 'drive-quiet', label: 'Drive runs without noise or heat' } as const;
const leaks = { key: 'no-leaks', label: 'No leaks at the collection container' } as const;
const trough = { key: 'trough-clear', label: 'Trough and wipers free of debris' } as const;
const wipers = { key: 'wipers-even', label: 'Wipers or scrapers touch the medium evenly' } as const;
const immersed = { key: 'medium-immersed', label: "Medium's lower end immersed in the liquid" } as const;
const oilLayer = { key: 'oil-layer', label: 'Oil layer measured and below the maximum the maker states' } as const;
const sludge = { key: 'sludge-depth', label: 'Sludge at the bottom below the depth that calls for pumping out' } as const;
const inletOutlet = { key: 'inlet-outlet-clear', label: 'Inlet, outlet and baffles free and in place' } as const;

export const upkeepChecklists: Record<Kind, readonly UpkeepItem[]> = {
  'belt-skimmer': [
    wipers,
    { key: 'medium-tracking', label: 'Medium runs centred and true on its pulley or drum' },
    trough,
    immersed,
    drive,
    leaks,
  ],
  'disc-skimmer': [
    wipers,
    { key: 'disc-true', label: 'Disc flat and true, not warped or scored' },
    { key: 'disc-immersion', label: 'Disc immersed to the depth the maker states at today’s level' },
    trough,
    drive,
    leaks,
  ],
  'drum-skimmer': [
    wipers,
    { key: 'drum-surface', label: 'Drum surface clean and smooth, not scored' },
    { key: 'drum-immersion', label: 'Drum immersed to the depth the maker states at today’s level' },
    trough,
    drive,
    leaks,
  ],
  'tube-skimmer': [
    { key: 'tube-condition', label: 'Tube not stretched, cracked or hardened' },
    { key: 'tube-path', label: 'Tube floats free across the surface, not snagged or tangled' },
    { key: 'scrapers-even', label: 'Scrapers clean the tube evenly' },
    drive,
    leaks,
  ],
  'mop-skimmer': [
    { key: 'mop-condition', label: 'Mop fibres not matted, torn or worn short' },
    { key: 'mop-path', label: 'Mop runs free around its tail pulley across the surface' },
    { key: 'wringer-even', label: 'Wringer rollers squeeze the mop evenly' },
    drive,
    leaks,
  ],
  'oil-water-separator': [
    oilLayer,
    sludge,
    { key: 'coalescer-clean', label: 'Coalescing media clean, not clogged or collapsed' },
    inletOutlet,
    { key: 'oil-draw-off', label: 'Oil draw-off or skimmer works' },
    { key: 'no-outlet-sheen', label: 'No sheen in the outlet chamber' },
  ],
  sump: [oilLayer, sludge, inletOutlet, { key: 'no-outlet-sheen', label: 'No sheen where the water leaves' }],
};

/** Every item label by key, for checks recorded under any kind's list. */
export const upkeepItemLabels: Record<string, string> = Object.fromEntries(
  Object.values(upkeepChecklists).flatMap((list) => list.map((item) => [item.key, item.label])),
);
