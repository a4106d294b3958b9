/**
 * The parts of ECharts that only the line and bar plots use (every ChartFigure), registered on top of
 * ./echarts-core.ts — kept apart so the Ladder's region map does not fetch them. Imported from
 * echarts/core directly: the registry is ECharts' own, shared by every import.
 */
import { use } from 'echarts/core';
import { BarChart, LineChart } from 'echarts/charts';
import { GridComponent, LegendComponent, MarkLineComponent } from 'echarts/components';

use([LineChart, BarChart, GridComponent, LegendComponent, MarkLineComponent]);
