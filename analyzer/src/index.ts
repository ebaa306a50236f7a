// Public surface of the analyzer library (pure: no database, HTTP or file writes).
export { SEVERITY_BANDS, severityBand } from './bands/severityBand';
export type { SeverityBand } from './bands/severityBand';
