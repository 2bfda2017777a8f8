export type ExportFormat = 'json' | 'csv';

/** A download link: the browser sends the session cookie, and the server names the file. */
export function exportVersionUrl(versionId: string, format: ExportFormat): string {
  return `/api/v1/model-versions/${encodeURIComponent(versionId)}/export?format=${format}`;
}
