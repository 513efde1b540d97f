/**
 * The teardown checklist, in the words technicians use in the yard. It is data: the screen, the
 * server's checks and the history all read it from here. An item's `part` is the line it suggests
 * when it is marked broken, so a finding becomes an estimate line with one tap.
 */
export interface ChecklistItem {
  code: string
  label: string
  /** What to look for, shown under the item. */
  look?: string
  /** The part an estimate line starts from when this item is broken. */
  part: string
}

export interface ChecklistSystem {
  code: string
  label: string
  items: ChecklistItem[]
}

export const CHECKLIST: readonly ChecklistSystem[] = [
  {
    code: 'suspension',
    label: 'Suspension and steering',
    items: [
      { code: 'ball-joints', label: 'Ball joints', look: 'Play or a separated joint; the wheel sits at an angle', part: 'Ball joint' },
      { code: 'tie-rods', label: 'Tie rods', look: 'Bent rod, worn end, loose boot', part: 'Tie rod end' },
      { code: 'control-arms', label: 'Control arms', look: 'Bent arm, torn bushings', part: 'Control arm' },
      { code: 'struts-shocks', label: 'Struts and shocks', look: 'Leaking, broken mount, bent body', part: 'Strut assembly' },
    ],
  },
  {
    code: 'drive-line',
    label: 'Drive line',
    items: [
      { code: 'drive-shafts', label: 'Drive shafts and axles', look: 'Broken or bent shaft, pulled out of the hub', part: 'Drive shaft' },
      { code: 'cv-joints', label: 'CV joints', look: 'Split boot, clicking, play', part: 'CV joint' },
    ],
  },
  {
    code: 'wheels',
    label: 'Wheels and tyres',
    items: [
      { code: 'wheels', label: 'Wheels', look: 'Bent or cracked rim, missing lug nuts', part: 'Wheel' },
      { code: 'tyres', label: 'Tyres', look: 'Flat, cut sidewall, tread worn through', part: 'Tyre' },
    ],
  },
  {
    code: 'brakes',
    label: 'Brakes',
    items: [
      { code: 'brakes-front', label: 'Front brakes', look: 'Pads, rotors, calipers, hoses', part: 'Front brake pads and rotors' },
      { code: 'brakes-rear', label: 'Rear brakes', look: 'Pads or shoes, rotors or drums', part: 'Rear brake pads and rotors' },
      { code: 'parking-brake', label: 'Parking brake', look: 'Holds the vehicle on a slope', part: 'Parking brake cable' },
    ],
  },
  {
    code: 'frame',
    label: 'Frame and rust',
    items: [
      { code: 'frame-rails', label: 'Frame rails', look: 'Hammer test: where the frame crunches, it is rotten', part: 'Frame rail repair section' },
      { code: 'spring-hangers', label: 'Spring and suspension mounts', look: 'Rust through at the hangers and mounts', part: 'Spring hanger' },
      { code: 'floor-pans', label: 'Floor and sills', look: 'Holes, soft metal under the mats', part: 'Floor pan patch' },
    ],
  },
  {
    code: 'engine',
    label: 'Engine and fluids',
    items: [
      { code: 'engine', label: 'Engine', look: 'Starts, knocks, smokes, oil level', part: 'Engine repair' },
      { code: 'fluid-leaks', label: 'Leaks', look: 'Oil, coolant, brake or transmission fluid under the car', part: 'Seal or hose' },
      { code: 'cooling', label: 'Radiator and cooling', look: 'Pushed in, leaking, fan broken', part: 'Radiator' },
    ],
  },
  {
    code: 'body',
    label: 'Body',
    items: [
      { code: 'front-body', label: 'Front end', look: 'Bumper, hood, fenders, headlamp mounts', part: 'Front bumper cover' },
      { code: 'rear-body', label: 'Rear end', look: 'Bumper, trunk lid, rear panel', part: 'Rear bumper cover' },
      { code: 'sides', label: 'Sides and doors', look: 'Dents, doors that do not open or close', part: 'Door shell' },
    ],
  },
  {
    code: 'glass',
    label: 'Glass',
    items: [
      { code: 'windshield', label: 'Windshield', look: 'Cracks in the driver’s view', part: 'Windshield' },
      { code: 'side-rear-glass', label: 'Side and rear glass', look: 'Broken or missing', part: 'Side window glass' },
    ],
  },
  {
    code: 'lights',
    label: 'Lights',
    items: [
      { code: 'headlamps', label: 'Headlamps', look: 'Broken lens, not working', part: 'Headlamp unit' },
      { code: 'rear-lamps', label: 'Tail and brake lamps', look: 'Broken lens, not working', part: 'Tail lamp unit' },
    ],
  },
]

export const FINDING_STATUSES = ['ok', 'worn', 'broken', 'not_checked'] as const
export type FindingStatus = (typeof FINDING_STATUSES)[number]

export const FINDING_LABELS: Record<FindingStatus, string> = { ok: 'OK', worn: 'Worn', broken: 'Broken', not_checked: 'Not checked' }

const ITEMS = new Map(CHECKLIST.flatMap((system) => system.items.map((item) => [item.code, { ...item, system }] as const)))

export const ITEM_CODES = [...ITEMS.keys()]

export function checklistItem(code: string): (ChecklistItem & { system: ChecklistSystem }) | undefined {
  return ITEMS.get(code)
}

/** "Ball joints (Suspension and steering)": how an item is named in a photo caption or the history. */
export function itemName(code: string): string {
  const item = ITEMS.get(code)
  return item ? `${item.label} (${item.system.label})` : code
}
