declare module "fmin";
