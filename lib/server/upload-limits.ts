import { DEFAULT_ZIP_LIMITS } from '@/lib/import/zip-read';

const MB = 1024 * 1024;
const fromEnv = (name: string, fallback: number) => {
  const value = Number(process.env[name]);
  return Number.isFinite(value) && value > 0 ? value : fallback;
};

/** Upload limits (BRIEF §7 defaults), configurable through the environment. */
export function uploadLimits() {
  return {
    maxFileBytes: fromEnv('PLUMEWARD_MAX_FILE_MB', 200) * MB,
    maxFiles: fromEnv('PLUMEWARD_MAX_FILES', 500),
    maxTotalBytes: fromEnv('PLUMEWARD_MAX_UPLOAD_MB', 2048) * MB,
    zip: DEFAULT_ZIP_LIMITS,
  };
}
