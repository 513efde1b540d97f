export { addClockEvent, clockEventsOf, type NewClockEvent } from './clock-events.queries'
export { clocksOfVehicles, vehicleClocks, vehicleClocksWith, type ClockedVehicle, type WorkedClocks } from './vehicle-clocks'
