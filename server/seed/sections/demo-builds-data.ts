// Invented demo content: no real people, vehicles, brands or shops.
export interface DemoEpisode {
  number: number;
  slug: string;
  title: string;
  summary: string;
  status: 'published' | 'scheduled' | 'draft';
  daysAgo: number;
  videoUrl: string | null;
  durationSeconds: number | null;
  minutesWorked: number;
  raisedVehicle: boolean;
  paragraphs: string[];
  /** [start seconds, title, vehicle system key?] */
  chapters: Array<[number, string, string?]>;
}

export interface DemoBuild {
  owner: string;
  slug: string;
  title: string;
  kind: 'car' | 'motorcycle';
  make: string;
  model: string;
  year: string;
  summary: string;
  currency: string;
  budgetMinor: number;
  editors: string[];
  episodes: DemoEpisode[];
  openItems: Array<{ title: string; note: string | null; openedIn: number; closedIn: number | null }>;
}

const video = (id: string) => `https://video.example.test/watch?v=${id}`;

export const demoBuilds: DemoBuild[] = [
  {
    owner: 'marta-kettleby',
    slug: 'marlowe-pipit-1976',
    title: '1976 Marlowe Pipit hatchback',
    kind: 'car',
    make: 'Marlowe',
    model: 'Pipit',
    year: '1976',
    summary: 'A small hatchback out of twenty years in a barn, brought back to the road one weekend at a time.',
    currency: 'EUR',
    budgetMinor: 450000,
    editors: ['jun-halloway'],
    episodes: [
      {
        number: 1,
        slug: 'dragging-it-home',
        title: 'Dragging it home',
        status: 'published',
        daysAgo: 21,
        summary: 'Twenty years in a barn: first look, seized brakes and a list of what it needs.',
        videoUrl: video('pipit-01'),
        durationSeconds: 1260,
        minutesWorked: 240,
        raisedVehicle: false,
        paragraphs: [
          'The Pipit came home on a borrowed trailer with all four wheels turning, just.',
          'First job: a full walk-round and a list. The brakes are seized on the front left and the coolant is brown.',
        ],
        chapters: [
          [0, 'Arrival'],
          [95, 'Walk-round'],
          [410, 'Seized front brake', 'brakes'],
          [780, 'The list for next time'],
        ],
      },
      {
        number: 2,
        slug: 'front-brakes-apart',
        title: 'Front brakes apart',
        status: 'published',
        daysAgo: 14,
        summary: 'Calipers off, a piston that would not move, and new flexible hoses on order.',
        videoUrl: video('pipit-02'),
        durationSeconds: 1530,
        minutesWorked: 330,
        raisedVehicle: true,
        paragraphs: [
          'Car up on stands on the level floor, wheels off, and the front left caliper came away after soaking overnight.',
          'The piston finally moved with gentle air pressure and a block of wood in the bore. New seals and hoses are on order.',
        ],
        chapters: [
          [0, 'Safe on stands'],
          [120, 'Caliper off', 'brakes'],
          [640, 'Freeing the piston', 'brakes'],
          [1100, 'What to order'],
        ],
      },
      {
        number: 3,
        slug: 'cooling-system-flush',
        title: 'Cooling system flush',
        status: 'published',
        daysAgo: 7,
        summary: 'Rusty coolant out, a new thermostat in, and the radiator cap that caused it all.',
        videoUrl: video('pipit-03'),
        durationSeconds: 1405,
        minutesWorked: 270,
        raisedVehicle: false,
        paragraphs: [
          'Engine cold before the cap came off: never open a hot pressurised system.',
          'Three flushes until the water ran clear, then a new thermostat. Old coolant went to the recycling point.',
        ],
        chapters: [
          [0, 'Cold engine, cap off', 'cooling'],
          [300, 'Flushing', 'cooling'],
          [820, 'Thermostat', 'cooling'],
          [1200, 'Refill plan'],
        ],
      },
      {
        number: 4,
        slug: 'brake-hoses-and-bleeding',
        title: 'Brake hoses and bleeding',
        status: 'scheduled',
        daysAgo: 0,
        summary: 'The new hoses arrive; fitting, bleeding and a first test on the drive.',
        videoUrl: video('pipit-04'),
        durationSeconds: 1320,
        minutesWorked: 210,
        raisedVehicle: true,
        paragraphs: ['New flexible hoses fitted and the system bled front to back.'],
        chapters: [
          [0, 'Unboxing the hoses'],
          [200, 'Fitting', 'brakes'],
          [700, 'Bleeding', 'brakes'],
        ],
      },
      {
        number: 5,
        slug: 'wiring-gremlins',
        title: 'Wiring gremlins',
        status: 'draft',
        daysAgo: 0,
        summary: 'Notes so far on the dead indicator circuit.',
        videoUrl: null,
        durationSeconds: null,
        minutesWorked: 90,
        raisedVehicle: false,
        paragraphs: ['Battery disconnected first. The left indicator has no feed at the switch.'],
        chapters: [],
      },
    ],
    openItems: [
      { title: 'Replace front flexible brake hoses', note: 'On order; fit and bleed before any road test.', openedIn: 1, closedIn: 4 },
      {
        title: 'Refill and bleed the cooling system',
        note: 'New coolant of the right type, mixed to the manual’s ratio.',
        openedIn: 3,
        closedIn: null,
      },
      { title: 'Trace the dead left indicator', note: null, openedIn: 2, closedIn: null },
    ],
  },
  {
    owner: 'ossie-brandt',
    slug: 'vantel-125-trail',
    title: '1971 Vantel 125 trail bike',
    kind: 'motorcycle',
    make: 'Vantel',
    model: '125 Trail',
    year: '1971',
    summary: 'A two-stroke single rescued from the scrap pile, rebuilt from the top end down.',
    currency: 'GBP',
    budgetMinor: 120000,
    editors: [],
    episodes: [
      {
        number: 1,
        slug: 'top-end-teardown',
        title: 'Top-end teardown',
        status: 'published',
        daysAgo: 10,
        summary: 'Barrel off a two-stroke single: scored piston, stuck rings and a measured bore.',
        videoUrl: video('vantel-01'),
        durationSeconds: 980,
        minutesWorked: 180,
        raisedVehicle: false,
        paragraphs: [
          'Head and barrel off. The piston is scored on the exhaust side and two rings are stuck in their grooves.',
          'Bore measured at three heights; it needs a rebore to the first oversize.',
        ],
        chapters: [
          [0, 'What we have'],
          [150, 'Head off', 'engine'],
          [420, 'Barrel and piston', 'engine'],
          [760, 'Measuring the bore', 'engine'],
        ],
      },
      {
        number: 2,
        slug: 'fuel-tap-and-tank',
        title: 'Fuel tap and tank',
        status: 'published',
        daysAgo: 3,
        summary: 'A leaking fuel tap, a rusty tank and what to do about both.',
        videoUrl: video('vantel-02'),
        durationSeconds: 860,
        minutesWorked: 150,
        raisedVehicle: false,
        paragraphs: ['Tank drained outside, well away from any flame. The tap leaks at the lever seal.'],
        chapters: [
          [0, 'Draining safely', 'fuel'],
          [260, 'The tap', 'fuel'],
          [600, 'Inside the tank', 'fuel'],
        ],
      },
    ],
    openItems: [
      { title: 'Rebore to first oversize and new piston', note: 'Barrel goes to the machine shop.', openedIn: 1, closedIn: null },
    ],
  },
];
