export * from './atomicWrite.js';
export * from './yamlFile.js';
