/**
 * State of the fixture schedule import: the file read into a preview, the junction chosen per
 * room and the plan those make. All the rules live in shared/import; this only holds choices.
 */
import type { Diagram } from '@shared/document/model'
import { fixtureImportOperation, type FixtureImportPlan } from '@shared/import/fixture-batch'
import { previewFixtureCsv, type FixturePreview } from '@shared/import/fixture-csv'
import { suggestFeeds, type RoomFeed } from '@shared/import/room-feeds'
import { computed, ref, shallowRef } from 'vue'
import { readTextFile } from '../export/read-file'

/** A fixture schedule is small; anything larger is not one. */
export const MAX_SCHEDULE_FILE_BYTES = 2 * 1_048_576

export function useFixtureImport(doc: () => Diagram) {
  const fileName = ref('')
  const readError = ref<string | null>(null)
  const preview = shallowRef<FixturePreview | null>(null)
  const feeds = ref<Record<string, RoomFeed>>({})
  /** The designer's explicit consent to leave rows with errors out. */
  const skipRejected = ref(false)

  function reset() {
    fileName.value = ''
    readError.value = null
    preview.value = null
    feeds.value = {}
    skipRejected.value = false
  }

  async function read(file: File) {
    reset()
    fileName.value = file.name
    try {
      const next = previewFixtureCsv(await readTextFile(file, MAX_SCHEDULE_FILE_BYTES), doc())
      preview.value = next
      feeds.value = suggestFeeds(doc(), next.rooms)
    } catch (e) {
      readError.value = (e as Error).message
    }
  }

  function setFeed(roomKey: string, system: keyof RoomFeed, id: string | null) {
    const current = feeds.value[roomKey] ?? { cold: null, hot: null }
    feeds.value = { ...feeds.value, [roomKey]: { ...current, [system]: id } }
  }

  const outcome = computed((): { plan: FixtureImportPlan } | { error: string } | null => {
    const p = preview.value
    if (!p || p.fileErrors.length || p.accepted === 0) return null
    try {
      return { plan: fixtureImportOperation(doc(), p, feeds.value) }
    } catch (e) {
      return { error: (e as Error).message }
    }
  })

  /** Why Apply is not possible yet, in words; empty when it is. */
  const blockers = computed(() => {
    const p = preview.value
    if (!p) return ['Choose a CSV file.']
    if (p.fileErrors.length) return p.fileErrors
    if (p.accepted === 0) return ['No row can be imported; correct the file and choose it again.']
    const out: string[] = []
    if (outcome.value && 'error' in outcome.value) out.push(outcome.value.error)
    if (p.rejected > 0 && !skipRejected.value) {
      out.push(
        `${p.rejected} row${p.rejected > 1 ? 's have' : ' has'} errors: correct the file, or confirm leaving them out.`,
      )
    }
    return out
  })

  const plan = computed(() =>
    blockers.value.length === 0 && outcome.value && 'plan' in outcome.value
      ? outcome.value.plan
      : null,
  )

  return { fileName, readError, preview, feeds, skipRejected, blockers, plan, read, reset, setFeed }
}
