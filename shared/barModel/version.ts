/** Version of the bar model and planner, stored with every saved plan; raise it when a plan for the same input would change. */
export const BAR_MODEL_VERSION = '1.0.0'
