/** The demo plant's settings, read once at start-up (.env.example documents them). */
export interface DemoConfig {
  databaseUrl: string;
  apiUrl: string;
  token: string;
  /** Demo seconds per wall-clock second for the fault script (sample periods stay real). */
  speed: number;
  seed: number;
}

/** Parses the environment; throws one error naming every problem. */
export function readDemoConfig(env: NodeJS.ProcessEnv): DemoConfig {
  const problems: string[] = [];
  const required = (name: string, hint: string) => {
    const value = env[name]?.trim();
    if (!value) problems.push(`${name} is required (${hint})`);
    return value ?? '';
  };
  const number = (name: string, fallback: number, valid: (v: number) => boolean, hint: string) => {
    const raw = env[name]?.trim();
    const value = raw ? Number(raw) : fallback;
    if (!Number.isFinite(value) || !valid(value)) problems.push(`${name} must be ${hint}, not "${raw}"`);
    return value;
  };
  const config = {
    databaseUrl: required('DATABASE_URL', 'the demo plant reads the demo loops from the database'),
    apiUrl: required('API_URL', 'where the api listens, e.g. http://127.0.0.1:4600').replace(/\/+$/, ''),
    token: required('DEMO_PLANT_TOKEN', 'the demo ingest source token; npm start creates it'),
    speed: number('DEMO_SPEED', 1, (v) => v > 0 && v <= 100, 'a number above 0 and at most 100'),
    seed: number('DEMO_SEED', 7, (v) => Number.isInteger(v), 'an integer'),
  };
  if (config.apiUrl && !/^https?:\/\//.test(config.apiUrl))
    problems.push(`API_URL must start with http:// or https://, not "${config.apiUrl}"`);
  if (problems.length) throw new Error(`the demo plant cannot start: ${problems.join('; ')}`);
  return config;
}
