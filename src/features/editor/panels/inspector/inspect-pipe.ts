/**
 * Builds the pipe inspector's content from the document and its result. Pure: the component only
 * renders what this returns, and every path (unknown pipe, invalid document) ends in words.
 */
import { explainPipe, type PipeExplanation } from '@shared/calc/explain'
import type { DiagramResult } from '@shared/calc/types'
import type { Diagram } from '@shared/document/model'
import { issueText } from '@shared/units/issue-text'
import type { UnitSystem } from '@shared/units/system'
import { nodeRefText } from '@shared/schedule/schedule-rows'
import { demandLines } from './inspector-demand'
import { loadLines } from './inspector-load'
import { pressureLines, sizeLines } from './inspector-size'
import { line, type InspectorSection, type PipeInspection } from './inspector-types'

function problemsSection(
  result: DiagramResult,
  pipeId: string,
  units: UnitSystem,
): InspectorSection {
  const named = result.issues.filter((i) => i.ids.includes(pipeId))
  return {
    key: 'problems',
    title: 'Problems naming this pipe',
    lines:
      named.length === 0
        ? [line('None: every check on this pipe passes.', 'note')]
        : named.map((i) => line(`${i.severity} ${i.code}: ${issueText(i, units)}`, 'problem')),
  }
}

/** The inspector's content for pipe `pipeId` of `doc`, using `result` (computeDiagram of `doc`). */
export function inspectPipe(
  doc: Diagram,
  result: DiagramResult,
  pipeId: string,
  units: UnitSystem,
): PipeInspection {
  const pipe = doc.pipes.find((p) => p.id === pipeId)
  if (!pipe) {
    return {
      pipeId,
      system: null,
      route: '',
      notice: `Pipe ${pipeId} is not in the diagram.`,
      sections: [],
    }
  }
  const label = (id: string) => doc.nodes.find((n) => n.id === id)?.label ?? ''
  const base = {
    pipeId,
    system: pipe.system,
    route: `${nodeRefText({ id: pipe.from, label: label(pipe.from) })} → ${nodeRefText({ id: pipe.to, label: label(pipe.to) })}`,
  }
  const problems = problemsSection(result, pipeId, units)
  if (!result.pipes[pipeId]) {
    const errors = result.issues.filter((i) => i.severity === 'error').length
    return {
      ...base,
      notice:
        `No results for this pipe: the diagram has ${errors} error${errors === 1 ? '' : 's'} that ` +
        'stop the calculation. Fix them (see Problems) and the breakdown appears here.',
      sections: [problems],
    }
  }
  let explanation: PipeExplanation | null
  try {
    explanation = explainPipe(doc, result, pipeId)
  } catch (error) {
    // A result that does not match the document (a stale read) must not take the panel down.
    const reason = error instanceof Error ? error.message : String(error)
    return { ...base, notice: `The breakdown could not be built: ${reason}`, sections: [problems] }
  }
  if (!explanation) {
    return { ...base, notice: `No results for pipe ${pipeId}.`, sections: [problems] }
  }
  const { settings } = doc
  return {
    ...base,
    notice: null,
    sections: [
      { key: 'load', title: 'Load', lines: loadLines(explanation, settings.loadBasis) },
      { key: 'demand', title: 'Flow', lines: demandLines(explanation, units) },
      { key: 'size', title: 'Size', lines: sizeLines(explanation.pipe, settings, units) },
      {
        key: 'pressure',
        title: 'Friction and pressure',
        lines: pressureLines(explanation, pipe.lengthM, settings, units),
      },
      problems,
    ],
  }
}
