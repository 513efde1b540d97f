// The invented town of Orrin Flats, as the local map stand-ins know it: a few streets (with house
// numbers from the first point to the last) and the places the demo yard's tows come from.
// Nothing here is a real place; the coordinates sit around the demo yard at 36.4127, -119.3521.

export type Point = [lat: number, lng: number]

export interface Street {
  name: string
  /** Other ways people type it, lower case. */
  aliases: string[]
  points: Point[]
  /** House numbers at the first and the last point. */
  numbers: [number, number]
}

export const TOWN = 'Orrin Flats'
/** Where a map of the town opens when no yard is placed yet (the first run). */
export const TOWN_CENTRE = { lat: 36.4127, lng: -119.3521 }

export const STREETS: Street[] = [
  { name: 'Quarry Spur Rd', aliases: ['quarry spur road', 'quarry spur'], points: [[36.4185, -119.364], [36.4127, -119.3521], [36.4075, -119.344], [36.406, -119.3418]], numbers: [0, 2400] },
  { name: 'Marlow Blvd', aliases: ['marlow boulevard', 'marlow'], points: [[36.408, -119.3385], [36.4132, -119.3381], [36.4231, -119.3377], [36.43, -119.3374]], numbers: [0, 2100] },
  { name: 'Kettle Ave', aliases: ['kettle avenue', 'kettle'], points: [[36.4231, -119.3377], [36.425, -119.3392], [36.429, -119.3418]], numbers: [0, 1800] },
  { name: 'Harrow Way', aliases: ['harrow'], points: [[36.42, -119.356], [36.4188, -119.3612], [36.4177, -119.365], [36.417, -119.372]], numbers: [0, 1200] },
  { name: 'Cinder Ln', aliases: ['cinder lane', 'cinder'], points: [[36.4132, -119.3381], [36.4109, -119.3455], [36.409, -119.35]], numbers: [0, 200] },
  { name: 'Old Mill Rd', aliases: ['old mill road', 'old mill'], points: [[36.428, -119.362], [36.4295, -119.368], [36.431, -119.376]], numbers: [0, 1400] },
  { name: 'Tule Rd', aliases: ['tule road', 'tule'], points: [[36.3921, -119.3301], [36.3945, -119.3275], [36.4004, -119.325], [36.3988, -119.319]], numbers: [0, 600] },
  { name: 'Larkspur Ct', aliases: ['larkspur court', 'larkspur'], points: [[36.433, -119.349], [36.4345, -119.351], [36.436, -119.3545]], numbers: [0, 2400] },
  { name: 'Juniper St', aliases: ['juniper street', 'juniper'], points: [[36.4195, -119.347], [36.4201, -119.3489], [36.4215, -119.352]], numbers: [0, 400] },
  { name: 'Alder St', aliases: ['alder street', 'alder'], points: [[36.417, -119.352], [36.416, -119.356], [36.414, -119.362]], numbers: [0, 1200] },
  { name: 'County Rd 14', aliases: ['county road 14', 'cr 14', 'county 14'], points: [[36.3899, -119.345], [36.3899, -119.336], [36.3921, -119.3301], [36.395, -119.32]], numbers: [0, 3000] },
]

/** Named places: exact answers for the addresses the demo's tows came from, and landmarks. */
export const PLACES: { name: string; point: Point }[] = [
  { name: '1480 Quarry Spur Rd (Quarry Spur yard)', point: [36.4127, -119.3521] },
  { name: 'Sunridge Plaza, 300 Harrow Way', point: [36.4188, -119.3612] },
  { name: '730 Harrow Way', point: [36.4177, -119.365] },
  { name: 'Harrow Way industrial park', point: [36.4195, -119.37] },
  { name: 'Marlow Blvd & Kettle Ave', point: [36.4231, -119.3377] },
  { name: 'Marlow Blvd & Cinder Ln', point: [36.4132, -119.3381] },
  { name: 'Marlow Blvd & Juniper St', point: [36.4215, -119.347] },
  { name: 'Kettle Ave & 3rd St', point: [36.4262, -119.3401] },
  { name: '14 Kettle Ave', point: [36.425, -119.3392] },
  { name: '1502 Kettle Ave', point: [36.4277, -119.3409] },
  { name: '45 Cinder Ln', point: [36.4109, -119.3455] },
  { name: '77 Cinder Ln', point: [36.4101, -119.347] },
  { name: '66 Old Mill Rd', point: [36.4288, -119.3665] },
  { name: '300 Old Mill Rd', point: [36.4295, -119.368] },
  { name: '1120 Old Mill Rd', point: [36.4302, -119.3711] },
  { name: '88 Juniper St', point: [36.4201, -119.3489] },
  { name: '210 Juniper St', point: [36.421, -119.3495] },
  { name: '501 Alder St', point: [36.416, -119.356] },
  { name: '940 Alder St', point: [36.4148, -119.359] },
  { name: '12 Larkspur Ct', point: [36.4345, -119.351] },
  { name: '2210 Larkspur Ct', point: [36.435, -119.352] },
  { name: 'Larkspur Court apartments', point: [36.434, -119.3534] },
  { name: '19 Tule Rd', point: [36.4004, -119.325] },
  { name: 'Tule Rd near mile 6', point: [36.3988, -119.319] },
  { name: 'Tule Rd & County Rd 14', point: [36.3945, -119.3275] },
  { name: 'County Rd 14 at Tule Rd', point: [36.3921, -119.3301] },
  { name: 'County Rd 14 overpass', point: [36.3899, -119.336] },
  { name: 'Quarry Spur Rd at the rail crossing', point: [36.406, -119.3418] },
  { name: 'Quarry Spur Rd near the gravel pit', point: [36.4021, -119.348] },
  { name: 'Orrin Flats Community College lot B', point: [36.4388, -119.344] },
]
