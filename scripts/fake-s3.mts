// `npm run fake-s3 -- [--port 4569] [--bucket ovenward] [--dir data/fake-s3]`: a local S3-compatible
// server for trying STORAGE=s3 on one machine; prints the settings that point Ovenward at it.
import { startFakeS3 } from "./support/fake-s3";

const arg = (name: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? process.argv[i + 1] : undefined;
};
const s3 = await startFakeS3({ port: Number(arg("port") ?? 4569), bucket: arg("bucket") ?? "ovenward", dir: arg("dir") ?? "data/fake-s3" });
console.log(`Fake S3 on ${s3.endpoint}, bucket "${s3.bucket}", objects in ${s3.dir}. Point Ovenward at it with:`);
for (const [k, v] of Object.entries(s3.env)) console.log(`  ${k}=${v}`);
const stop = () => void s3.close().then(() => process.exit(0));
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
