export { createFakeSearchServer, type FakeSearchServer, type FakeSearchServerOptions } from './server';
