// The invented demo scenario: one made-up older coupé getting an engine and gearbox swap, and its three people.
export const DEMO_PASSWORD = 'demo-garage-2026';

export const DEMO_PEOPLE = [
  { email: 'builder@example.com', displayName: 'Robin Ashgrove', role: 'owner' },
  { email: 'crew@example.com', displayName: 'Tam Okonkwo-Reyes', role: 'crew' },
  { email: 'partner@example.com', displayName: 'Ines Marchetti', role: 'reviewer' },
] as const;

export const DEMO_BUILD = {
  name: 'Kestrel coupé swap',
  vehicle: '1979 Halden Kestrel GT coupé, 2.0 L turbo four and five-speed swap',
  currency: 'USD',
  locale: 'en-US',
  status: 'active' as const,
  startedOn: '2026-08-03',
  targetDate: '2027-03-28',
};

/** System budgets of the demo build, in USD; the contingency is held back besides. */
export const DEMO_BUDGETS: Record<string, string> = {
  Engine: '4200.00',
  'Wiring harness': '900.00',
  Cooling: '700.00',
  Fuel: '450.00',
  Drivetrain: '1500.00',
  Exhaust: '600.00',
  Brakes: '800.00',
  Suspension: '900.00',
  'Safety and track inspection': '400.00',
  Interior: '300.00',
  Body: '500.00',
  'Tools and consumables': '350.00',
};
export const DEMO_CONTINGENCY = '1000.00';

type DemoPart = [system: string, description: string, partNumber: string, quantity: string, unit: string, unitCost: string, status: string, location: string];

/** Invented parts and prices for the demo bill of materials. */
export const DEMO_PARTS: DemoPart[] = [
  ['Engine', 'Turbo four long block, 2.0 L (used, compression tested)', 'LB-20T-114', '1', 'each', '2400.00', 'installed', ''],
  ['Engine', 'Engine mount kit, swap brackets', 'KM-330', '1', 'set', '189.00', 'installed', ''],
  ['Engine', 'Programmable engine computer', 'EC-8X', '1', 'each', '1150.00', 'on_hand', 'Office shelf'],
  ['Engine', 'Oil, 5W-30 synthetic', 'OL-530', '6', 'qt', '8.49', 'on_hand', 'Fluids rack'],
  ['Wiring harness', 'Standalone engine harness, unterminated', 'WH-200', '1', 'each', '640.00', 'installed', ''],
  ['Wiring harness', '16 AWG cross-linked wire, red', 'W16-RD', '25', 'ft', '0.18', 'on_hand', 'Wire drawer'],
  ['Wiring harness', 'Heat-shrink assortment, adhesive lined', 'HS-ASST', '1', 'set', '19.95', 'on_hand', 'Wire drawer'],
  ['Wiring harness', 'Sealed relay and fuse box', 'RB-6', '1', 'each', '74.00', 'ordered', ''],
  ['Cooling', 'Electric water pump, 12 V', 'EWP-12', '1', 'each', '329.00', 'installed', ''],
  ['Cooling', 'Aluminium radiator, two-row', 'RAD-2R', '1', 'each', '285.00', 'installed', ''],
  ['Cooling', 'Coolant, 50/50 premix', 'CL-5050', '2', 'gal', '17.49', 'on_hand', 'Fluids rack'],
  ['Cooling', 'Silicone hose kit', 'SHK-4', '1', 'set', '96.50', 'planned', ''],
  ['Fuel', 'In-tank fuel pump, 255 L/h', 'FP-255', '1', 'each', '139.00', 'on_hand', 'Shelf A3'],
  ['Fuel', 'Fuel pump relay and fuse kit', 'FPR-K', '1', 'set', '28.50', 'ordered', ''],
  ['Fuel', 'Fuel hose, 3/8 in, submersible', 'FH-38S', '6', 'ft', '6.25', 'planned', ''],
  ['Drivetrain', 'Five-speed gearbox (used)', 'GB-5S', '1', 'each', '900.00', 'installed', ''],
  ['Drivetrain', 'Clutch kit, organic disc', 'CK-228', '1', 'set', '310.00', 'installed', ''],
  ['Drivetrain', 'Driveshaft shortening and balance', 'DS-SVC', '1', 'each', '180.00', 'planned', ''],
  ['Exhaust', 'Downpipe, 2.5 in', 'DP-25', '1', 'each', '215.00', 'planned', ''],
  ['Brakes', 'Brake pads, front, street compound', 'BP-F21', '1', 'set', '64.00', 'on_hand', 'Shelf A1'],
  ['Brakes', 'Brake fluid, DOT 4', 'BF-D4', '2', 'L', '11.20', 'on_hand', 'Fluids rack'],
  ['Safety and track inspection', 'Fire extinguisher, 2.5 lb, with mount', 'FE-25', '1', 'each', '89.00', 'planned', ''],
  ['Safety and track inspection', 'Track inspection fee', '', '1', 'each', '75.00', 'planned', ''],
  ['Tools and consumables', 'Open-barrel crimping tool', 'CT-OB', '1', 'each', '64.00', 'on_hand', 'Tool wall'],
  ['Interior', 'Spare gauge pod (left over)', 'GP-52', '1', 'each', '38.00', 'on_hand', 'Shelf C1'],
];
