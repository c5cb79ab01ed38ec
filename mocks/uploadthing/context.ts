import type { Registrations } from "./registrations";
import type { FileStore } from "./store";

export interface FakeContext {
  store: FileStore;
  registrations: Registrations;
  apiKey: string;
  appId: string;
  /** Origin the fake hands out in file URLs and as the callback `origin`, e.g. http://127.0.0.1:12112 */
  publicUrl: string;
  /** How long a PUT waits for the app's /callback-result, and a callback request may take. */
  callbackTimeoutMs: number;
  /** How long a PUT waits for its /route-metadata registration to arrive. */
  registrationTimeoutMs: number;
  /** How long a registration (and a dev stream) stays open with files not yet uploaded. */
  registrationTtlMs: number;
  warn(message: string): void;
}
