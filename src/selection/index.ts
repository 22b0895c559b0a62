/** Public API of the selection: analysis files, cut expressions, variables, the engine and its results. */
export type { Analysis, Cut, SelectionStep, SignalRegion, CorrelationGroup, ReferenceCutflow } from './analysis.js';
export { loadAnalysis, loadAnalyses, parseAnalysis, type LoadOptions } from './loader.js';
export { AnalysisFileSchema, type AnalysisFile } from './schema.js';
export { OBJECT_DEFAULTS, resolveObjects } from './objectDefaults.js';
export { AnalysisObjects, SelectedObjects, type ObjectDefinitions, type KinematicThresholds, type LeptonDefinition, type OverlapRemoval } from './objects.js';
export { VARIABLES, variableNames, variableSlot, type VariableDefinition } from './variables.js';
export { EventVariables, variablesOfEvent } from './eventVariables.js';
export { parseExpression } from './expression/parser.js';
export { printExpression, variablesOf, type CutExpression } from './expression/ast.js';
export { compileExpression, type CompiledCut, type VariableReader } from './expression/compile.js';
export { tokenize, type Token, type ComparisonOperator } from './expression/lexer.js';
export { createSelection, type Selection, type SelectionOptions } from './engine.js';
export { mergeSelectionResults, weightedCount, type WeightedCount, type StepResult, type RegionResult, type CutBlame, type RegionOverlap, type AnalysisResult, type SelectionResults } from './results.js';
export { selectEventFile, STREAM_DETECTOR, type EventFileOptions, type EventFileResults } from './eventFile.js';
export { formatCutflow } from './cutflowText.js';
export { checkFile, fileKindOf, type CheckOutcome, type CheckedKind } from './checkFile.js';
export { analysisTemplate, writeNewAnalysis } from './template.js';
export { variableTableMarkdown, variableTableText, withVariableTable } from './variableDocs.js';
