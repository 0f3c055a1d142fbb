// The small vocabulary of trade words the last suggestion source falls back on: which kind of car system a word on a
// receipt line belongs to, and which words in a build's own (free-named) system names mark a system of that kind.
// Every entry is common practice in the trade, written from general knowledge (not from a published list).

export interface TradeVocabulary {
  /** Said in the reason: "‘thermostat’ is a cooling word". */
  kind: string;
  /** A build's system belongs to this kind when its name holds one of these words (or starts with one). */
  systemWords: readonly string[];
  /** Words and phrases of a line's description; a phrase counts once per word it has. */
  words: readonly string[];
}

/** Common practice; order matters only to break ties between kinds that match equally well. */
export const TRADE_WORDS: readonly TradeVocabulary[] = [
  {
    kind: 'cooling',
    systemWords: ['cooling', 'radiator', 'coolant'],
    words: ['radiator', 'thermostat', 'coolant', 'antifreeze', 'hose', 'hose clamp', 'water pump', 'fan shroud', 'expansion tank', 'overflow tank', 'radiator cap', 'intercooler'],
  },
  {
    kind: 'wiring',
    systemWords: ['wiring', 'harness', 'electrical', 'electrics', 'loom'],
    words: ['relay', 'fuse', 'terminal', 'connector', 'loom', 'wire', 'harness', 'heat shrink', 'splice', 'grommet', 'switch', 'awg', 'battery cable'],
  },
  {
    kind: 'fuel',
    systemWords: ['fuel'],
    words: ['injector', 'fuel pump', 'fuel filter', 'fuel line', 'fuel hose', 'fuel rail', 'fuel pressure', 'regulator', 'fuel tank', 'sender', 'fuel'],
  },
  {
    kind: 'drivetrain',
    systemWords: ['drivetrain', 'driveline', 'transmission', 'gearbox'],
    words: ['clutch', 'axle', 'cv', 'cv joint', 'gearbox', 'transmission', 'driveshaft', 'propshaft', 'differential', 'u-joint', 'flywheel', 'gear oil', 'slave cylinder'],
  },
  {
    kind: 'brake',
    systemWords: ['brake', 'brakes', 'braking'],
    words: ['pads', 'brake pads', 'rotor', 'disc', 'caliper', 'brake fluid', 'brake line', 'master cylinder', 'brake hose', 'drum', 'shoes'],
  },
  {
    kind: 'fluids',
    systemWords: ['fluids', 'fluid', 'lubricants'],
    words: ['oil', 'coolant fluid', 'atf', 'grease', 'fluid'],
  },
  {
    kind: 'engine',
    systemWords: ['engine', 'motor'],
    words: ['spark plug', 'plug', 'timing belt', 'timing chain', 'gasket', 'head gasket', 'piston', 'camshaft', 'oil filter', 'alternator', 'starter', 'turbo', 'ecu', 'long block', 'engine mount', 'oxygen sensor', 'o2'],
  },
  {
    kind: 'exhaust',
    systemWords: ['exhaust'],
    words: ['exhaust', 'muffler', 'silencer', 'downpipe', 'manifold', 'catalytic', 'header', 'tailpipe', 'v-band'],
  },
  {
    kind: 'suspension',
    systemWords: ['suspension', 'steering', 'chassis'],
    words: ['shock', 'strut', 'spring', 'coilover', 'bushing', 'control arm', 'tie rod', 'ball joint', 'sway bar', 'wheel bearing'],
  },
  {
    kind: 'safety',
    systemWords: ['safety', 'inspection'],
    words: ['extinguisher', 'harness belt', 'roll bar', 'kill switch', 'inspection'],
  },
  {
    kind: 'interior',
    systemWords: ['interior', 'cabin', 'trim'],
    words: ['gauge', 'seat', 'carpet', 'steering wheel', 'dash', 'shift knob'],
  },
  {
    kind: 'body',
    systemWords: ['body', 'paint', 'bodywork'],
    words: ['panel', 'fender', 'bumper', 'primer', 'paint', 'filler', 'weatherstrip', 'hood', 'door'],
  },
  {
    kind: 'shop supplies',
    systemWords: ['tools', 'consumables', 'supplies', 'shop'],
    words: ['gloves', 'towels', 'rags', 'degreaser', 'cleaner', 'zip ties', 'tape', 'tool', 'crimper', 'sealant', 'drill bit', 'sandpaper'],
  },
];
