import { deserialize, serialize } from 'node:v8';
import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv();

// jest's jsdom environment has no structuredClone, which browsers have and dagre's layout uses to
// copy plain layout data; Node's serializer gives the same copy for such data.
globalThis.structuredClone ??= ((value: unknown) => deserialize(serialize(value))) as typeof structuredClone;
