/** One hue per layer a pick is assigned to, on the travel-time curves and in the depth section. */
export const LAYER_COLOURS = ['#8c6d31', '#0072b2', '#b2182b'] as const;
export const LEFT_OUT_COLOUR = '#a8a29e';

export const layerName = (layer: number): string => (layer < 0 ? 'Left out' : layer === 0 ? 'Direct wave' : `Refractor ${layer}`);
export const layerColour = (layer: number): string => (layer < 0 ? LEFT_OUT_COLOUR : LAYER_COLOURS[layer] ?? LEFT_OUT_COLOUR);
