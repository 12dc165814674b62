import { Chart, LinearScale, LineElement, PointElement, ScatterController, Tooltip } from "chart.js";
import zoomPlugin from "chartjs-plugin-zoom";

// Only the parts a scatter graph with lines needs, so the rest of Chart.js stays out of the bundle.
Chart.register(ScatterController, LinearScale, PointElement, LineElement, Tooltip, zoomPlugin);

export { Chart };
