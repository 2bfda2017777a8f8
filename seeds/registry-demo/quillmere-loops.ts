import type { Matrix } from '@shadowloop/simulator/engine';

/**
 * The invented loops of the Quillmere Water Reclamation Works demo plant. Each model is written
 * in continuous time from the physics of its equipment (time constants in seconds, gains in the
 * signals' units) and discretised by the engine's zero-order hold when seeded. Demo numbers only.
 */
export interface DemoVersion {
  Ac: Matrix;
  Bc: Matrix;
  C?: Matrix;
  correction: { mode: 'free_run' | 'reset' | 'kalman'; Q?: Matrix; R?: Matrix };
  changeNote: string;
  status: 'active' | 'in_review';
  daysAgo: number;
}

export interface DemoLoop {
  tag: string;
  name: string;
  area: string;
  description: string;
  samplePeriodS: number;
  inputs: { name: string; unit: string }[];
  states: { name: string; unit: string }[];
  outputs: { name: string; unit: string }[];
  operatingPoint: { x0: number[]; u0: number[]; y0: number[] };
  /** Allowed |residual| per output, in the output's unit: a few times the noise seen before faults. */
  residualBand: number[];
  versions: DemoVersion[];
}

export const DEMO_AREAS = [
  { id: 'aeration', name: 'Aeration', sort_order: 1 },
  { id: 'storage', name: 'Storage', sort_order: 2 },
  { id: 'digestion', name: 'Digestion', sort_order: 3 },
  { id: 'disinfection', name: 'Disinfection', sort_order: 4 },
];

const diagonal = (values: number[]): Matrix => values.map((v, i) => values.map((_, j) => (i === j ? v : 0)));

/** Blower speed → header air flow (lag 15 s, 60 Nm³/h per %) → dissolved oxygen (transfer lag 4 min). */
function aerationModel(transferTauS: number, gainPerFlow: number): Pick<DemoVersion, 'Ac' | 'Bc' | 'C'> {
  return {
    Ac: [
      [-1 / 15, 0],
      [gainPerFlow / transferTauS, -1 / transferTauS],
    ],
    Bc: [[60 / 15], [0]],
    C: [[0, 1]],
  };
}

/** Two tanks in series with gravity outflow: areas 80 m² and 60 m², outflow resistances 15 and 12.5 s/m². */
const storageModel = {
  Ac: [
    [-1 / 1200, 0],
    [1 / 900, -1 / 750],
  ],
  Bc: [[1 / (3600 * 80)], [0]],
};

/**
 * Digester heat balance: sludge 1.2e10 J/K, jacket water 2e7 J/K, wall 5e7 J/K; water→wall 200 kW/K,
 * wall→sludge 150 kW/K, wall→air 10 kW/K, sludge→ground and feed 20 kW/K; the valve gives 20 kW per %.
 */
function digesterModel(): Pick<DemoVersion, 'Ac' | 'Bc'> {
  const [cs, cw, cm] = [1.2e10, 2.0e7, 5.0e7];
  const [waterWall, wallSludge, wallAir, sludgeLoss, valve] = [2.0e5, 1.5e5, 1.0e4, 2.0e4, 2.0e4];
  return {
    Ac: [
      [-(wallSludge + sludgeLoss) / cs, 0, wallSludge / cs],
      [0, -waterWall / cw, waterWall / cw],
      [wallSludge / cm, waterWall / cm, -(waterWall + wallSludge + wallAir) / cm],
    ],
    Bc: [[0], [valve / cw], [0]],
  };
}

/** Hypochlorite dose into 1500 m³/h (0.083 mg/L per L/h), three contact compartments with decay, analyser lag 90 s. */
function chlorineModel(): Pick<DemoVersion, 'Ac' | 'Bc' | 'C'> {
  const [t1, t2, t3, analyser, decay, dose] = [240, 300, 360, 90, 5e-5, 0.0833];
  return {
    Ac: [
      [-1 / t1 - decay, 0, 0, 0],
      [1 / t2, -1 / t2 - decay, 0, 0],
      [0, 1 / t3, -1 / t3 - decay, 0],
      [0, 0, 1 / analyser, -1 / analyser],
    ],
    Bc: [[dose / t1], [0], [0], [0]],
    C: [[0, 0, 0, 1]],
  };
}

const temperature = (name: string) => ({ name, unit: '°C' });

export const DEMO_LOOPS: DemoLoop[] = [
  {
    tag: 'AER-DO-101',
    name: 'Basin 1 dissolved oxygen',
    area: 'aeration',
    samplePeriodS: 10,
    description: 'Blower B1 speed against dissolved oxygen at the basin 1 outlet probe.',
    inputs: [{ name: 'Blower speed', unit: '%' }],
    states: [
      { name: 'Header air flow', unit: 'Nm³/h' },
      { name: 'Dissolved oxygen', unit: 'mg/L' },
    ],
    outputs: [{ name: 'Dissolved oxygen', unit: 'mg/L' }],
    operatingPoint: { x0: [3720, 2.0], u0: [62], y0: [2.0] },
    residualBand: [0.15],
    versions: [
      {
        ...aerationModel(240, 0.0012),
        correction: { mode: 'free_run' },
        status: 'active',
        daysAgo: 21,
        changeNote: 'Identified from the step tests of the spring blower survey.',
      },
      {
        ...aerationModel(300, 0.001),
        correction: { mode: 'free_run' },
        status: 'in_review',
        daysAgo: 1,
        changeNote: 'Slower oxygen transfer after the diffuser inspection found fouling on grid 3.',
      },
    ],
  },
  {
    tag: 'STO-LT-201',
    name: 'Storage tanks 1 and 2 levels',
    area: 'storage',
    samplePeriodS: 30,
    description: 'Inlet pump P201 flow against the levels of the two storage tanks in series.',
    inputs: [{ name: 'Inlet pump flow', unit: 'm³/h' }],
    states: [
      { name: 'Tank 1 level', unit: 'm' },
      { name: 'Tank 2 level', unit: 'm' },
    ],
    outputs: [
      { name: 'Tank 1 level', unit: 'm' },
      { name: 'Tank 2 level', unit: 'm' },
    ],
    operatingPoint: { x0: [3.0, 2.5], u0: [720], y0: [3.0, 2.5] },
    residualBand: [0.03, 0.03],
    versions: [
      {
        ...storageModel,
        correction: { mode: 'reset' },
        status: 'active',
        daysAgo: 30,
        changeNote: 'Linearised gravity outflow at the normal levels.',
      },
    ],
  },
  {
    tag: 'DIG-TT-301',
    name: 'Digester 1 heating',
    area: 'digestion',
    samplePeriodS: 60,
    description: 'Hot-water valve V301 against sludge, jacket water and wall temperatures of digester 1.',
    inputs: [{ name: 'Hot-water valve', unit: '%' }],
    states: [
      temperature('Sludge temperature'),
      temperature('Jacket water temperature'),
      temperature('Wall temperature'),
    ],
    outputs: [
      temperature('Sludge temperature'),
      temperature('Jacket water temperature'),
      temperature('Wall temperature'),
    ],
    operatingPoint: { x0: [37.0, 55.0, 45.0], u0: [40], y0: [37.0, 55.0, 45.0] },
    residualBand: [0.4, 0.6, 0.6],
    versions: [
      {
        ...digesterModel(),
        status: 'active',
        daysAgo: 45,
        changeNote: 'Heat balance of the digester, jacket and wall.',
        correction: { mode: 'kalman', Q: diagonal([1e-5, 1e-3, 1e-4]), R: diagonal([0.01, 0.04, 0.04]) },
      },
    ],
  },
  {
    tag: 'DIS-CL-401',
    name: 'Chlorine contact residual',
    area: 'disinfection',
    samplePeriodS: 15,
    description: 'Hypochlorite dosing pump against the free chlorine residual at the contact tank outlet.',
    inputs: [{ name: 'Hypochlorite dosing rate', unit: 'L/h' }],
    states: [
      { name: 'Compartment 1 chlorine', unit: 'mg/L' },
      { name: 'Compartment 2 chlorine', unit: 'mg/L' },
      { name: 'Compartment 3 chlorine', unit: 'mg/L' },
      { name: 'Analyser reading', unit: 'mg/L' },
    ],
    outputs: [{ name: 'Free chlorine residual', unit: 'mg/L' }],
    operatingPoint: { x0: [1.48, 1.46, 1.43, 1.43], u0: [18], y0: [1.43] },
    residualBand: [0.06],
    versions: [
      {
        ...chlorineModel(),
        correction: { mode: 'free_run' },
        status: 'active',
        daysAgo: 10,
        changeNote: 'Contact tank tracer study and analyser lag.',
      },
    ],
  },
];
