import type { StorageConfig } from "../config";
import { FAKE_S3_CREDENTIALS, startFakeS3 } from "./fake-s3";
import { ObjectStore } from "./object-store";

export { ObjectStore } from "./object-store";

export interface RunningStorage {
  store: ObjectStore;
  /** The local fake's address, when one was started. */
  fakeEndpoint: string | undefined;
  close(): Promise<void>;
}

/**
 * The object store the app uses: the configured bucket, or (no S3_ENDPOINT) a local
 * S3-compatible fake on 127.0.0.1 keeping its files under `fakeDir`.
 */
export async function startStorage(config: StorageConfig): Promise<RunningStorage> {
  const fake = config.endpoint
    ? undefined
    : await startFakeS3(config.fakeDir, config.bucket, config.fakePort);
  const credentials = fake
    ? { ...FAKE_S3_CREDENTIALS }
    : config.accessKeyId && config.secretAccessKey
      ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey }
      : undefined; // the SDK's own chain: environment, instance role, …
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
