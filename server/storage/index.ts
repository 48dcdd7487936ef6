import type { StorageConfig } from "../config";
import { newStandInCredentials } from "../standins";
import { startFakeS3 } from "./fake-s3";
import { ObjectStore } from "./object-store";

export { ObjectStore } from "./object-store";

export interface RunningStorage {
  store: ObjectStore;
  /** The local stand-in's address, when this call started one. */
  fakeEndpoint: string | undefined;
  close(): Promise<void>;
}

/**
 * The object store the app uses: the configured bucket (under `npm start`, the stand-in
 * process's), or (no S3_ENDPOINT: tests, benches) an S3 stand-in started here on 127.0.0.1,
 * with its files under `fakeDir` and credentials of its own.
 */
export async function startStorage(config: StorageConfig): Promise<RunningStorage> {
  const own = config.endpoint ? undefined : newStandInCredentials().s3;
  const fake = own
    ? await startFakeS3(config.fakeDir, config.bucket, own, config.fakePort)
    : undefined;
  const credentials =
    own ??
    (config.accessKeyId && config.secretAccessKey
      ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey }
      : undefined); // the SDK's own chain: environment, instance role, …
  const endpoint = fake?.endpoint ?? config.endpoint;
  if (!endpoint) throw new Error("no object storage endpoint");
  const store = new ObjectStore({
    endpoint,
    bucket: config.bucket,
    region: config.region,
    credentials,
    forcePathStyle: fake ? true : config.forcePathStyle,
    cacheDir: config.cacheDir,
  });
  return {
    store,
    fakeEndpoint: fake?.endpoint,
    async close() {
      store.close();
      await fake?.close();
    },
  };
}
