export { mulberry32 } from './mulberry32';
export { normalRandom } from './normal-random';
