import { describe, expect, test } from 'vitest'
import { BATTERY_DEFAULTS, batteryOperation } from '@shared/document/battery'
import { applyOperation, OperationError } from '@shared/document/operations'
import { expectSound } from './arbitraries'
import { sampleDiagram } from './sample'

describe('batteryOperation, grouped', () => {
  test('a flush valve battery: one fixture node with the count, one cold pipe', () => {
    const doc = sampleDiagram()
    const { op, fixtureIds, pipeIds } = batteryOperation(doc, {
      parentId: 'J2',
      fixture: 'water-closet-flush-valve',
      count: 6,
      usesHot: false,
    })
    const after = applyOperation(doc, op)
    expectSound(after)
    expect(fixtureIds).toEqual(['F2'])
    expect(after.nodes.find((node) => node.id === 'F2')).toMatchObject({
      kind: 'fixture',
      fixture: 'water-closet-flush-valve',
      count: 6,
      levelId: 'L2',
      elevationM: 3.2,
    })
    expect(pipeIds).toEqual(['P7'])
    expect(after.pipes.at(-1)).toEqual({
      id: 'P7',
      from: 'J2',
      to: 'F2',
      system: 'cold',
      lengthM: BATTERY_DEFAULTS.dropM,
    })
  })

  test('a fixture using hot water gets a hot pipe from the hot parent too', () => {
    const doc = sampleDiagram()
    const { op } = batteryOperation(doc, {
      parentId: 'J2',
      hotParentId: 'WH1',
      fixture: 'lavatory',
      count: 4,
      usesHot: true,
    })
    const after = applyOperation(doc, op)
    expect(after.pipes.slice(-2).map(({ from, to, system }) => [from, to, system])).toEqual([
      ['J2', 'F2', 'cold'],
      ['WH1', 'F2', 'hot'],
    ])
  })

  test('a hot-only appliance hangs off the hot parent alone', () => {
    const doc = sampleDiagram()
    const { op } = batteryOperation(doc, {
      parentId: 'WH1',
      fixture: 'dishwasher',
      count: 2,
      usesHot: true,
      usesCold: false,
    })
    const after = applyOperation(doc, op)
    expect(after.pipes.slice(-1).map(({ from, to, system }) => [from, to, system])).toEqual([
      ['WH1', 'F2', 'hot'],
    ])
  })
})

describe('batteryOperation, individual', () => {
  test('N fixtures along a new header: a junction per fixture and system, pipes between', () => {
    const doc = sampleDiagram()
    const result = batteryOperation(doc, {
      parentId: 'J2',
      hotParentId: 'WH1',
      fixture: 'lavatory',
      count: 3,
      usesHot: true,
      layout: 'individual',
    })
    const after = applyOperation(doc, result.op)
    expectSound(after)
    expect(result.fixtureIds).toEqual(['F2', 'F3', 'F4'])
    expect(result.nodeIds).toHaveLength(3 + 3 + 3)
    const added = after.pipes.filter((pipe) => result.pipeIds.includes(pipe.id))
    const cold = added
      .filter((pipe) => pipe.system === 'cold')
      .map(({ from, to, lengthM }) => `${from}>${to}:${lengthM}`)
    expect(cold).toEqual(['J2>J3:1', 'J3>F2:1.5', 'J3>J4:1', 'J4>F3:1.5', 'J4>J5:1', 'J5>F4:1.5'])
    const hot = added.filter((pipe) => pipe.system === 'hot').map(({ from, to }) => `${from}>${to}`)
    expect(hot).toEqual(['WH1>J6', 'J6>F2', 'J6>J7', 'J7>F3', 'J7>J8', 'J8>F4'])
    for (const id of result.fixtureIds) {
      expect(after.nodes.find((node) => node.id === id)).toMatchObject({ count: 1 })
    }
  })

  test('custom spacing and drop lengths are used', () => {
    const doc = sampleDiagram()
    const { op, pipeIds } = batteryOperation(doc, {
      parentId: 'J2',
      fixture: 'urinal-flush-valve',
      count: 2,
      usesHot: false,
      layout: 'individual',
      spacingM: 0.6,
      dropM: 0.9,
    })
    const after = applyOperation(doc, op)
    const lengths = after.pipes
      .filter((pipe) => pipeIds.includes(pipe.id))
      .map((pipe) => pipe.lengthM)
    expect(lengths).toEqual([0.6, 0.9, 0.6, 0.9])
  })
})

describe('batteryOperation refusals', () => {
  test.each([
    [
      'a missing parent',
      { parentId: 'J9', fixture: 'lavatory', count: 2, usesHot: false },
      /battery: parentId: no node with id J9/,
    ],
    [
      'a fixture as parent',
      { parentId: 'F1', fixture: 'lavatory', count: 2, usesHot: false },
      /battery: parentId: F1 is a fixture and cannot feed/,
    ],
    [
      'hot without a hot parent',
      { parentId: 'J2', fixture: 'lavatory', count: 2, usesHot: true },
      /battery: hotParentId: a fixture using hot water needs a hot parent/,
    ],
    [
      'a zero count',
      { parentId: 'J2', fixture: 'lavatory', count: 0, usesHot: false },
      /battery: count: Too small/,
    ],
    [
      'a fractional count',
      { parentId: 'J2', fixture: 'lavatory', count: 2.5, usesHot: false },
      /battery: count: /,
    ],
    [
      'no fixture key',
      { parentId: 'J2', fixture: '', count: 2, usesHot: false },
      /battery: fixture: /,
    ],
    [
      'neither system',
      { parentId: 'J2', fixture: 'lavatory', count: 2, usesHot: false, usesCold: false },
      /must draw cold or hot/,
    ],
  ])('refuses %s', (_name, options, message) => {
    expect(() => batteryOperation(sampleDiagram(), options)).toThrow(OperationError)
    expect(() => batteryOperation(sampleDiagram(), options)).toThrow(message)
  })
})
