import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { resolve } from 'node:path';
import pg from 'pg';
import type { DataSource } from 'typeorm';
import { createIdentityProvider } from '../../idp/identity-provider.js';
import { createApp } from '../../server/app.js';
import { createDataSource } from '../../server/db/data-source.js';
import { testConfig, testAppDatabaseUrl } from './test-env.js';

export interface LiveStack {
  appUrl: string;
  idpUrl: string;
  dataSource: DataSource;
  close(): Promise<void>;
}

async function listenOnLoopback(): Promise<{ server: Server; url: string }> {
  const server = createServer();
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

/**
 * The app and the test identity provider on free loopback ports, in this process, so a test
 * can sign in for real and close everything afterwards. `withClient` serves the built client.
 */
export async function startLiveStack(options: { withClient?: boolean } = {}): Promise<LiveStack> {
  const appListener = await listenOnLoopback();
  const idpListener = await listenOnLoopback();
  const config = testConfig({
    appUrl: appListener.url,
    oidc: { issuer: idpListener.url, clientId: 'decant-test', clientSecret: 'decant-test-secret', isLocalFake: true },
    demo: true,
  });
  const idp = createIdentityProvider({
    issuer: idpListener.url,
    client: { clientId: 'decant-test', clientSecret: 'decant-test-secret', appUrls: [appListener.url] },
  });
  const dataSource = await createDataSource(testAppDatabaseUrl, { asApp: true }).initialize();
  // Each stack's provider is new (its issuer carries a random port), and a person bound to an
  // earlier provider's subject is never re-bound: the demo people start unbound here.
  await dataSource.query(`UPDATE app_user SET subject = NULL WHERE email LIKE '%@decant.test'`);
  const sessionPool = new pg.Pool({ connectionString: testAppDatabaseUrl, max: 3 });
  const clientDir = options.withClient ? resolve(import.meta.dirname, '../../dist') : undefined;
  appListener.server.on('request', createApp({ config, dataSource, sessionPool, clientDir }));
  idpListener.server.on('request', idp);

  const closeServer = (server: Server) =>
    new Promise<void>((done) => {
      server.closeAllConnections();
      server.close(() => done());
    });
  return {
    appUrl: appListener.url,
    idpUrl: idpListener.url,
    dataSource,
    close: async () => {
      await Promise.all([closeServer(appListener.server), closeServer(idpListener.server)]);
      await sessionPool.end();
      await dataSource.destroy();
    },
  };
}
