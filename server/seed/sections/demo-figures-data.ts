// Invented demo figures on the invented demo builds: for the vehicles in those episodes only.
import type { FigureInput } from '../../../src/shared/schemas/figures';

export interface DemoFigures {
  owner: string;
  buildSlug: string;
  episodeSlug: string;
  figures: FigureInput[];
}

const base: Pick<FigureInput, 'angleStages' | 'wrenchRange' | 'note' | 'systemKey'> = {
  angleStages: [],
  wrenchRange: null,
  note: null,
  systemKey: null,
};

export const demoFigures: DemoFigures[] = [
  {
    owner: 'marta-kettleby',
    buildSlug: 'marlowe-pipit-1976',
    episodeSlug: 'front-brakes-apart',
    figures: [
      {
        ...base,
        fastener: 'Caliper carrier bolts',
        thread: 'M10x1.25',
        gradeFitted: '10.9',
        gradeSpecified: '10.9',
        method: 'torque',
        value: 40,
        unit: 'lbf-ft',
        source: 'workshop-manual',
        wrenchRange: { min: 20, max: 100, unit: 'N-m' },
        systemKey: 'brakes',
        note: 'Threads cleaned, new bolts from the seal kit.',
      },
      {
        ...base,
        fastener: 'Brake pipe bracket screw',
        thread: 'M6',
        gradeFitted: '8.8',
        gradeSpecified: '8.8',
        method: 'snug',
        value: 6,
        unit: 'N-m',
        source: 'common-practice',
        wrenchRange: { min: 20, max: 100, unit: 'N-m' },
        systemKey: 'brakes',
        note: 'The only wrench starts at 20 N·m, so this one was done by hand and feel.',
      },
      {
        ...base,
        fastener: 'Track-rod end nut (checked while the wheel was off)',
        thread: '3/8-24 UNF',
        gradeFitted: 'SAE 5',
        gradeSpecified: 'SAE 5',
        method: 'torque',
        value: 28,
        unit: 'lbf-ft',
        source: 'workshop-manual',
        wrenchRange: { min: 15, max: 80, unit: 'lbf-ft' },
        systemKey: 'steering',
      },
    ],
  },
  {
    owner: 'marta-kettleby',
    buildSlug: 'marlowe-pipit-1976',
    episodeSlug: 'cooling-system-flush',
    figures: [
      {
        ...base,
        fastener: 'Thermostat housing bolts',
        thread: 'M8',
        gradeFitted: 'A2-70',
        gradeSpecified: '8.8',
        method: 'torque',
        value: 18,
        unit: 'N-m',
        source: 'workshop-manual',
        wrenchRange: { min: 5, max: 25, unit: 'N-m' },
        systemKey: 'cooling',
        note: 'Stainless from the spares tin for now; proper 8.8 bolts are on the list.',
      },
      {
        ...base,
        fastener: 'Water pump pulley bolts',
        thread: 'M6',
        gradeFitted: '8.8',
        gradeSpecified: '8.8',
        method: 'torque',
        value: 90,
        unit: 'lbf-in',
        source: 'workshop-manual',
        wrenchRange: { min: 40, max: 200, unit: 'lbf-in' },
        systemKey: 'engine',
      },
    ],
  },
  {
    owner: 'ossie-brandt',
    buildSlug: 'vantel-125-trail',
    episodeSlug: 'top-end-teardown',
    figures: [
      {
        ...base,
        fastener: 'Cylinder head nuts',
        thread: 'M8',
        gradeFitted: '8.8',
        gradeSpecified: '8.8',
        method: 'torque-angle',
        value: 1,
        unit: 'kgf-m',
        angleStages: [30, 30],
        source: 'workshop-manual',
        wrenchRange: { min: 5, max: 25, unit: 'N-m' },
        systemKey: 'engine',
        note: 'Crosswise to the first figure in two passes, then the angle in two stages.',
      },
    ],
  },
  {
    owner: 'ossie-brandt',
    buildSlug: 'vantel-125-trail',
    episodeSlug: 'fuel-tap-and-tank',
    figures: [
      {
        ...base,
        fastener: 'Fuel tap screws',
        thread: 'M6',
        gradeFitted: 'A2-70',
        gradeSpecified: 'A2-70',
        method: 'snug',
        value: null,
        unit: 'N-m',
        source: 'common-practice',
        systemKey: 'fuel',
        note: 'New fibre washers; snug only, the tank flange is thin.',
      },
    ],
  },
];
