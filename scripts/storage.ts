// Object-store chores: ensure-bucket (run by npm start and npm test).
import { ensureBucket, bucket } from '@/lib/storage/s3';

async function main(): Promise<void> {
  if (process.argv[2] !== 'ensure-bucket') throw new Error(`unknown command '${process.argv[2]}': use ensure-bucket`);
  await ensureBucket();
  console.log(`[skywell] object store bucket '${bucket()}' is ready`);
}

main().catch((error: unknown) => {
  console.error(`[skywell] object store: ${error instanceof Error ? error.message : String(error)} (check S3_ENDPOINT and the keys)`);
  process.exit(1);
});
