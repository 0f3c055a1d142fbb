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
  startedOn: '2026-07-01',
  targetDate: '2027-03-28',
};

/** System budgets of the demo build, in USD; the contingency is held back besides. */
export const DEMO_BUDGETS: Record<string, string> = {
  Engine: '5400.00',
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

/**
 * Invented parts and prices for the demo bill of materials, with the status each ends the demo history in (the
 * receipts in demo-history.ts buy them; filing moves "ordered" ones onto the shelf and the return sends one back).
 */
export const DEMO_PARTS: DemoPart[] = [
  ['Engine', 'Turbo four long block, 2.0 L (used, compression tested)', 'LB-20T-114', '1', 'each', '2400.00', 'installed', ''],
  ['Engine', 'Engine mount kit, swap brackets', 'KM-330', '1', 'set', '189.00', 'installed', ''],
  ['Engine', 'Programmable engine computer', 'EC-8X', '1', 'each', '1150.00', 'on_hand', 'Office shelf'],
  ['Engine', 'Oil, 5W-30 synthetic', 'OL-530', '11', 'qt', '8.49', 'on_hand', 'Fluids rack'],
  ['Engine', 'Oil filter, long', 'OF-118', '1', 'each', '9.99', 'installed', ''],
  ['Engine', 'Alternator, remanufactured, 90 A', 'ALT-90R', '1', 'each', '170.00', 'installed', ''],
  ['Engine', 'Starter motor, remanufactured', 'STR-22R', '1', 'each', '155.00', 'installed', ''],
  ['Engine', 'Timing belt kit with tensioner', 'TBK-20', '1', 'set', '150.00', 'installed', ''],
  ['Engine', 'Turbo oil feed line kit, -4 AN', 'TOF-4AN', '1', 'set', '65.00', 'on_hand', 'Shelf B2'],
  ['Engine', 'Wideband oxygen sensor kit', 'WB-O2K', '1', 'set', '199.00', 'on_hand', 'Office shelf'],
  ['Engine', 'Spark plugs, one step colder', 'SP-C7', '4', 'each', '11.49', 'on_hand', 'Shelf B2'],
  ['Wiring harness', 'Standalone engine harness, unterminated', 'WH-200', '1', 'each', '640.00', 'installed', ''],
  ['Wiring harness', '16 AWG cross-linked wire, red', 'W16-RD', '75', 'ft', '0.18', 'on_hand', 'Wire drawer'],
  ['Wiring harness', '16 AWG cross-linked wire, black', 'W16-BK', '75', 'ft', '0.18', 'on_hand', 'Wire drawer'],
  ['Wiring harness', 'Heat-shrink assortment, adhesive lined', 'HS-ASST', '1', 'set', '19.95', 'on_hand', 'Wire drawer'],
  ['Wiring harness', 'Open-barrel terminals, 100 pack', 'TRM-OB100', '2', 'each', '16.00', 'on_hand', 'Wire drawer'],
  ['Wiring harness', 'Sealed relay and fuse box', 'RB-6', '1', 'each', '74.00', 'installed', ''],
  ['Wiring harness', 'Weatherproof connector kit, 2 to 6 pin', 'WPC-K', '1', 'set', '50.00', 'on_hand', 'Wire drawer'],
  ['Wiring harness', 'Cooling fan sub-harness with relay', 'FSH-2', '1', 'each', '60.00', 'installed', ''],
  ['Wiring harness', 'Mini fuse and relay kit', 'FRK-8', '2', 'set', '24.99', 'on_hand', 'Wire drawer'],
  ['Wiring harness', 'Ignition sub-harness, coil on plug', 'IGH-4', '1', 'each', '95.00', 'on_hand', 'Wire drawer'],
  ['Cooling', 'Electric water pump, 12 V', 'EWP-12', '1', 'each', '329.00', 'planned', ''],
  ['Cooling', 'Aluminium radiator, two-row', 'RAD-2R', '1', 'each', '285.00', 'installed', ''],
  ['Cooling', 'Coolant, 50/50 premix', 'CL-5050', '2', 'gal', '17.49', 'on_hand', 'Fluids rack'],
  ['Cooling', 'Silicone hose kit', 'SHK-4', '1', 'set', '96.50', 'planned', ''],
  ['Fuel', 'In-tank fuel pump, 255 L/h', 'FP-255', '1', 'each', '139.00', 'installed', ''],
  ['Fuel', 'Fuel pressure regulator, adjustable, -8 AN', 'FPR-8AN', '1', 'each', '89.00', 'ordered', ''],
  ['Fuel', 'Fuel pressure regulator, adjustable, -6 AN', 'FPR-6AN', '1', 'each', '89.00', 'installed', ''],
  ['Fuel', 'Fuel filter, 10 micron', 'FF-10', '1', 'each', '34.00', 'installed', ''],
  ['Fuel', 'AN fittings assortment, -6', 'ANF-6', '1', 'set', '40.00', 'installed', ''],
  ['Fuel', 'Fuel pump relay and fuse kit', 'FPR-K', '1', 'set', '28.50', 'installed', ''],
  ['Fuel', 'Fuel hose, 3/8 in, submersible', 'FH-38S', '6', 'ft', '6.25', 'installed', ''],
  ['Drivetrain', 'Five-speed gearbox (used)', 'GB-5S', '1', 'each', '900.00', 'installed', ''],
  ['Drivetrain', 'Clutch kit, organic disc', 'CK-228', '1', 'set', '310.00', 'installed', ''],
  ['Drivetrain', 'Gear oil, 75W-90', 'GO-7590', '3', 'qt', '11.49', 'installed', ''],
  ['Drivetrain', 'Driveshaft shortening and balance', 'DS-SVC', '1', 'each', '180.00', 'planned', ''],
  ['Exhaust', 'Downpipe, 2.5 in', 'DP-25', '1', 'each', '215.00', 'planned', ''],
  ['Brakes', 'Brake pads, front, street compound', 'BP-F21', '1', 'set', '64.00', 'on_hand', 'Shelf A1'],
  ['Brakes', 'Brake fluid, DOT 4', 'BF-D4', '2', 'L', '11.20', 'on_hand', 'Fluids rack'],
  ['Safety and track inspection', 'Fire extinguisher, 2.5 lb, with mount', 'FE-25', '1', 'each', '89.00', 'on_hand', 'Shelf C2'],
  ['Safety and track inspection', 'Track inspection fee', '', '1', 'each', '75.00', 'planned', ''],
  ['Tools and consumables', 'Open-barrel crimping tool', 'CT-OB', '1', 'each', '64.00', 'on_hand', 'Tool wall'],
  ['Interior', 'Boost gauge, 52 mm', 'BG-52', '1', 'each', '79.00', 'on_hand', 'Shelf C1'],
  ['Interior', 'Spare gauge pod (left over)', 'GP-52', '1', 'each', '38.00', 'on_hand', 'Shelf C1'],
];

/** What the demo build's inbox turned away: a shop's mailing that no one on the build sent (invented shop and address). */
export const DEMO_REFUSED_MAIL = {
  fromAddress: 'offers@sprocket-and-gasket.example',
  subject: 'Gasket week: 20 % off head gasket sets',
  reason: 'not_a_member',
  detail: 'offers@sprocket-and-gasket.example is not the owner or crew of this build. Forward the receipt from the address you sign in with.',
} as const;
