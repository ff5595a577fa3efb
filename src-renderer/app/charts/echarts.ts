/**
 * ECharts with only the parts the review screen draws: line and scatter series,
 * grid, tooltip, legend, data zoom, mark lines and graphics, label layout (overlap
 * hiding), canvas renderer.
 */
import * as echarts from 'echarts/core';
import { LineChart, ScatterChart, type LineSeriesOption, type ScatterSeriesOption } from 'echarts/charts';
import {
  GridComponent, TooltipComponent, LegendComponent, DataZoomComponent, MarkLineComponent,
  GraphicComponent, TitleComponent, AxisPointerComponent,
  type GridComponentOption, type TooltipComponentOption, type LegendComponentOption,
  type DataZoomComponentOption, type MarkLineComponentOption, type GraphicComponentOption, type TitleComponentOption,
} from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';
import { LabelLayout } from 'echarts/features';

echarts.use([
  LineChart, ScatterChart, GridComponent, TooltipComponent, LegendComponent, DataZoomComponent,
  MarkLineComponent, GraphicComponent, TitleComponent, AxisPointerComponent, CanvasRenderer, LabelLayout,
]);

export type ChartOption = echarts.ComposeOption<
  | LineSeriesOption | ScatterSeriesOption | GridComponentOption | TooltipComponentOption | LegendComponentOption
  | DataZoomComponentOption | MarkLineComponentOption | GraphicComponentOption | TitleComponentOption
>;
export type { LineSeriesOption, ScatterSeriesOption };
export { echarts };
