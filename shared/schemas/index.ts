export * from './study';
export { formatValue, outOfRangeMessage, quantity, label, type Range } from './quantity';
