import config from "@contend/eslint-config";

export default config;
