import { z } from 'zod';

// Vite exposes its own build facts on import.meta.env; only these are read by the client.
const envSchema = z.object({
  MODE: z.string().min(1),
  DEV: z.boolean(),
  BASE_URL: z.string().startsWith('/'),
});

export type Env = z.infer<typeof envSchema>;

function parseEnv(): Env {
  const result = envSchema.safeParse(import.meta.env);
  if (!result.success) {
    const problems = result.error.issues
      .map((issue) => `- ${issue.path.join('.') || '(root)'}: ${issue.message}`)
      .join('\n');
    throw new Error(`The client environment is missing or invalid:\n${problems}`);
  }
  return result.data;
}

export const env = parseEnv();
