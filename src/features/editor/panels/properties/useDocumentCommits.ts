/**
 * One validated operation per edit. Each function checks the patch against the schemas first, so
 * an invalid value never reaches the document, then applies it through the store; it returns the
 * message to show beside the field, or null when the change was applied.
 */
import type { LevelPatch, NodePatch, PipePatch, SettingsPatch } from '@shared/document/operations'
import type { UnitSystem } from '@shared/units/system'
import { useDocumentStore } from '@/stores/document'
import { levelPatchError, nodePatchError, pipePatchError, settingsPatchError } from './field-errors'

export function useDocumentCommits(units: () => UnitSystem) {
  const store = useDocumentStore()

  const refused = (outcome: { ok: true } | { ok: false; error: string }) =>
    outcome.ok ? null : outcome.error

  function updateNode(id: string, patch: NodePatch, label: string): string | null {
    const node = store.doc.nodes.find((n) => n.id === id)
    if (!node) return `Node ${id} no longer exists`
    const invalid = nodePatchError(node, patch, label, units())
    return invalid ?? refused(store.apply({ type: 'node.update', id, patch }))
  }

  function updatePipe(id: string, patch: PipePatch, label: string): string | null {
    const pipe = store.doc.pipes.find((p) => p.id === id)
    if (!pipe) return `Pipe ${id} no longer exists`
    const invalid = pipePatchError(pipe, patch, label, units())
    return invalid ?? refused(store.apply({ type: 'pipe.update', id, patch }))
  }

  function updateSettings(patch: SettingsPatch, label: string): string | null {
    const invalid = settingsPatchError(store.doc.settings, patch, label, units())
    return invalid ?? refused(store.apply({ type: 'settings.update', patch }))
  }

  function updateLevel(id: string, patch: LevelPatch, label: string): string | null {
    const level = store.doc.levels.find((l) => l.id === id)
    if (!level) return `Level ${id} no longer exists`
    const invalid = levelPatchError(level, patch, label, units())
    return invalid ?? refused(store.apply({ type: 'level.update', id, patch }))
  }

  return { updateNode, updatePipe, updateSettings, updateLevel }
}
