// Sets up Angular's zoneless test environment for every component spec.
import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv();

// A component spec compiles its page and types key by key; on a busy 2-core machine the first test of a file came near
// jest's 5 s default. A real hang still fails, at 15 s.
jest.setTimeout(15_000);
