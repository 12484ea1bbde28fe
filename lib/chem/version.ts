/** Version of the prediction engine; stored beside every saved prediction so results can be traced to the model. */
export const ENGINE_VERSION = "1.0.0";
