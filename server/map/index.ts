export { mapRouter } from './map.routes'
export { LOCAL_MAP, cspSources, usesLocalFakes, type MapConfig } from './map-config'
