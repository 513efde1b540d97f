export { clockStepsRouter } from './clock-steps.routes'
export { clockStepsPage, recordClockStep } from './clock-steps.service'
