import { createIdentityProvider } from './identity-provider.js';

// Its own process, started by `npm start`; only ever listens on loopback.
const port = Number(process.env.IDP_PORT ?? 4281);
const appUrls = (process.env.APP_URLS ?? `http://127.0.0.1:${process.env.PORT ?? 4280}`).split(',');
const issuer = `http://127.0.0.1:${port}`;

const app = createIdentityProvider({
  issuer,
  client: {
    clientId: process.env.OIDC_CLIENT_ID ?? 'decant-local',
    clientSecret: process.env.OIDC_CLIENT_SECRET ?? 'decant-local-secret',
    appUrls,
  },
});
const server = app.listen(port, '127.0.0.1', () => console.log(`Test identity provider listening on ${issuer}`));
const stop = () => server.close(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
