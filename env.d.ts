/// <reference types="vite/client" />

// The ES module build vue-leaflet imports when it is not given a global Leaflet (the map preloads it).
declare module 'leaflet/dist/leaflet-src.esm'
