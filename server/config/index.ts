export { loadConfig, APP_VERSION } from './config';
export type { Config, OAuthConfig } from './config';
