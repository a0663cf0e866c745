import {dimensions} from '../../quantities/dimensions.js';
import type {Corner} from './evaluation.js';

/** A corner as JSON and records keep it: how it was found, and each ranged input's end with its SI number, unit and text. */
export type CornerJson = {method: Corner['method']; inputs: Array<{id: string; end: 'low' | 'high' | 'inside' | 'either'; si: number; unit: string; text: string}>};

/** The corner a check was judged at, as plain data. */
export function cornerToJson(corner: Corner): CornerJson {
	return {method: corner.method, inputs: corner.inputs.map(({id, end, value}) => ({id, end, si: value.si, unit: dimensions[value.dimension].si, text: value.text}))};
}
