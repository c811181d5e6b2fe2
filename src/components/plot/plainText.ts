/**
 * User text (shot ids, names) going into a plotly chart: plotly reads trace names, hover
 * templates, point text, annotations and titles as a small HTML dialect (<a href>, <b>, <br>),
 * so a shot id of `<a href=…>` would become a live link. Escaping &, < and > makes it plain
 * text again; plotly turns the entities back into the characters when it draws them.
 * Every user string bound for a chart goes through this; our own markup (<br>, <b>) stays outside.
 */
export function plainText(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}
