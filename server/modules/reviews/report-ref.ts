/** What the report route passes to its review-status provider. */
export interface ReportRevisionRef {
  projectId: string
  diagramId: string
  revision: number
}
