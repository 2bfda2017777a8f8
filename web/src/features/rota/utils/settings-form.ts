import type { AlertSettings } from '@shadowloop/api/contracts';

export type SettingsKey = keyof AlertSettings;
export type SettingsText = Record<SettingsKey, string>;

export const SETTING_FIELDS: { key: SettingsKey; label: string; unit: string }[] = [
  { key: 'secondaryAfterMin', label: 'Call the secondary after', unit: 'min' },
  { key: 'areaAfterMin', label: "Call the area's engineers after", unit: 'min' },
  { key: 'ackLinkTtlMin', label: 'Acknowledge links work for', unit: 'min' },
  { key: 'shelveMaxHours', label: 'Longest shelf', unit: 'h' },
  { key: 'targetPerDay', label: 'Target: alerts a day', unit: 'alerts' },
  { key: 'targetPer10Min', label: 'Target: alerts per 10 minutes', unit: 'alerts' },
  { key: 'floodPer10Min', label: 'A flood is more than', unit: 'alerts in 10 min' },
];

export const settingsText = (settings: AlertSettings): SettingsText =>
  Object.fromEntries(SETTING_FIELDS.map(({ key }) => [key, String(settings[key])])) as SettingsText;

/** Whole numbers of at least 1, and the area step after the secondary's; the server checks the upper limits. */
export function readSettings(
  text: SettingsText,
): { settings: AlertSettings; problems: null } | { settings: null; problems: Partial<SettingsText> } {
  const problems: Partial<SettingsText> = {};
  const settings = {} as AlertSettings;
  for (const { key } of SETTING_FIELDS) {
    const value = Number(text[key].trim());
    if (text[key].trim() === '' || !Number.isInteger(value) || value < 1)
      problems[key] = 'Enter a whole number of at least 1.';
    else settings[key] = value;
  }
  if (!problems.areaAfterMin && !problems.secondaryAfterMin && settings.areaAfterMin <= settings.secondaryAfterMin) {
    problems.areaAfterMin = 'The area step must come after the secondary is called.';
  }
  return Object.keys(problems).length ? { settings: null, problems } : { settings, problems: null };
}
