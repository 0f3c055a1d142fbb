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
