/** App settings from the environment, parsed once with zod; a bad value stops start-up with its name. */
import { z } from 'zod';

const schema = z.object({
  BONDMAP_PUBLIC_URL: z.string().url('must be a URL such as https://bondmap.example.test').optional(),
  BONDMAP_DEMO: z.enum(['0', '1']).default('1'),
});

export type Settings = z.infer<typeof schema>;

let cached: Settings | null = null;

export function settings(): Settings {
  if (cached) return cached;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    throw new Error(`Bad settings: ${parsed.error.issues.map((i) => `${i.path.join('.')} ${i.message}`).join('; ')}`);
  }
  cached = parsed.data;
  return cached;
}

/** The address people use to reach the app, for links in messages. */
export function publicUrl(requestUrl: URL): string {
  return (settings().BONDMAP_PUBLIC_URL ?? requestUrl.origin).replace(/\/$/, '');
}
