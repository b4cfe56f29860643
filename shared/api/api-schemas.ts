// Names for the contract's schemas, so both sides import `Health` rather than the generated path.
// The generated file comes from openapi.yaml: `npm run generate:api-types`.
import type { components, operations } from './openapi-types';

type Schemas = components['schemas'];

export type Health = Schemas['Health'];
export type ProblemDetails = Schemas['ProblemDetails'];

// Calculations and selection.
export type FlowUnit = Schemas['FlowUnit'];
export type HeadUnit = Schemas['HeadUnit'];
export type LengthUnit = Schemas['LengthUnit'];
export type DiameterUnit = Schemas['DiameterUnit'];
export type PowerUnit = Schemas['PowerUnit'];
export type CalculationUnits = Schemas['CalculationUnits'];
export type FittingCount = Schemas['FittingCount'];
export type PipeSegment = Schemas['PipeSegment'];
export type PipeSystem = Schemas['PipeSystem'];
export type PipeBranch = Schemas['PipeBranch'];
export type BranchFlowSummary = Schemas['BranchFlow'];
export type SystemCurveRequest = Schemas['SystemCurveRequest'];
export type SystemCurvePoint = Schemas['SystemCurvePoint'];
export type SystemCurveResponse = Schemas['SystemCurveResponse'];
export type PumpCurvePointInput = Schemas['PumpCurvePoint'];
export type InlinePump = Schemas['InlinePump'];
export type CatalogPump = Schemas['CatalogPump'];
export type PumpSpeedRequest = Schemas['PumpSpeedRequest'];
export type PumpSpeedAnswer = Schemas['PumpSpeedAnswer'];
export type PumpArrangement = Schemas['PumpArrangement'];
export type OperatingPointArrangement = Schemas['OperatingPointArrangement'];
export type MixedSetEntry = Schemas['MixedSetEntry'];
export type PreferredBandInput = Schemas['PreferredBand'];
export type OperatingPointRequest = Schemas['OperatingPointRequest'];
export type CableRunRequest = Schemas['CableRunRequest'];
export type CableRunResponse = Schemas['CableRunResponse'];
export type CableDropAnswer = Schemas['CableDrop'];
export type BalanceTarget = Schemas['BalanceTarget'];
export type Balancing = Schemas['Balancing'];
export type OperatingRegionName = Schemas['OperatingRegion'];
export type OperatingPointSummary = Schemas['OperatingPoint'];
export type MixedSetOperatingPoint = Schemas['MixedSetOperatingPoint'];
export type MixedSetPumpPoint = Schemas['MixedSetPumpPoint'];
export type CurveFitSummary = Schemas['CurveFitSummary'];
export type OperatingPointResponse = Schemas['OperatingPointResponse'];
export type NpshCheck = Schemas['NpshCheck'];
export type PipeSizesResponse = Schemas['PipeSizesResponse'];
export type FittingsResponse = Schemas['FittingsResponse'];
export type DutyBand = Schemas['DutyBand'];
export type SelectionFilters = Schemas['SelectionFilters'];
export type EnergyInputs = Schemas['EnergyInputs'];
export type SelectionRequest = Schemas['SelectionRequest'];
export type SelectionWarning = Schemas['SelectionWarning'];
export type SelectionCandidate = Schemas['SelectionCandidate'];
export type SelectionKeep = Schemas['SelectionKeep'];
export type KeptSetPoint = Schemas['KeptSetPoint'];
export type KeptSetPumpPoint = Schemas['KeptSetPumpPoint'];
export type PipeSizeSuggestion = Schemas['PipeSizeSuggestion'];
export type SelectionResponse = Schemas['SelectionResponse'];

// Catalog and curve imports.
export type PumpKind = Schemas['PumpKind'];
export type SiUnits = Schemas['SiUnits'];
export type SupplierRef = Schemas['SupplierRef'];
export type SupplierList = Schemas['SupplierList'];
export type FlowRange = Schemas['FlowRange'];
export type BestEfficiencyPoint = Schemas['BestEfficiencyPoint'];
export type PumpSummary = Schemas['PumpSummary'];
export type PumpPage = Schemas['PumpPage'];
export type CurvePointSi = Schemas['CurvePointSi'];
export type DeclaredRanges = Schemas['DeclaredRanges'];
export type StoredPumpCurveFit = Schemas['PumpCurveFit'];
export type CurveFileUnits = Schemas['CurveFileUnits'];
export type CurveRevisionSummary = Schemas['CurveRevisionSummary'];
export type CurveRevisionDetail = Schemas['CurveRevisionDetail'];
export type PumpDetail = Schemas['PumpDetail'];
export type CurveImportIssue = Schemas['CurveImportIssue'];
export type CurveImportPump = Schemas['CurveImportPump'];
export type CurveImportReport = Schemas['CurveImportReport'];
export type CurveImportRecord = Schemas['CurveImportRecord'];
export type CurveImportList = Schemas['CurveImportList'];

// Accounts and access.
export type Role = Schemas['Role'];
export type ApiScope = Schemas['ApiScope'];
export type AccountUser = Schemas['AccountUser'];
export type SignInRequest = Schemas['SignInRequest'];
export type SignInResponse = Schemas['SignInResponse'];
export type PasswordResetRequest = Schemas['PasswordResetRequest'];
export type AcceptedMessage = Schemas['AcceptedMessage'];
export type NewPasswordRequest = Schemas['NewPasswordRequest'];
export type PasswordChange = Schemas['PasswordChange'];
export type InvitationAcceptance = Schemas['InvitationAcceptance'];
export type ApiTokenSummary = Schemas['ApiTokenSummary'];
export type ApiTokenRevokedReason = Schemas['ApiTokenRevokedReason'];
export type RevokedApiTokens = Schemas['RevokedApiTokens'];
export type ApiTokenList = Schemas['ApiTokenList'];
export type NewApiToken = Schemas['NewApiToken'];
export type CreatedApiToken = Schemas['CreatedApiToken'];
export type CandidateColumn = Schemas['CandidateColumn'];
export type Preferences = Schemas['Preferences'];
export type PreferencesInput = Schemas['PreferencesInput'];
export type AdminUser = Schemas['AdminUser'];
export type AdminUserList = Schemas['AdminUserList'];
export type UserChanges = Schemas['UserChanges'];
export type NewInvitation = Schemas['NewInvitation'];
export type InvitationSummary = Schemas['InvitationSummary'];
export type InvitationList = Schemas['InvitationList'];
export type AuditEventList = Schemas['AuditEventList'];
export type AuditEventView = AuditEventList['events'][number];
export type DemoMailbox = Schemas['DemoMailbox'];
export type DemoMailMessage = DemoMailbox['messages'][number];
// projects
export type DesignDraft = Schemas['DesignDraft'];
export type DesignSystem = Schemas['DesignSystem'];
export type DesignBranch = Schemas['DesignBranch'];
export type DesignSearch = Schemas['DesignSearch'];
export type ProjectInput = Schemas['ProjectInput'];
export type Project = Schemas['Project'];
export type ProjectList = Schemas['ProjectList'];
export type ProjectChoiceInput = Schemas['ProjectChoiceInput'];
export type ProjectChoice = Schemas['ProjectChoice'];
export type ProjectVisit = Schemas['ProjectVisit'];
export type ChoiceOutcome = Schemas['ChoiceOutcome'];
export type DesignOutcome = Schemas['DesignOutcome'];
export type RevisionComparison = Schemas['RevisionComparison'];
export type ProjectRecheck = Schemas['ProjectRecheck'];
export type ProjectRevisionView = Schemas['ProjectRevision'];
export type ProjectRevisionList = Schemas['ProjectRevisionList'];

// Query parameters of the contract's operations, as the server reads them once validated and coerced.
type QueryOf<Operation extends keyof operations> = NonNullable<operations[Operation]['parameters']['query']>;
export type PumpListQuery = QueryOf<'listPumps'>;
export type PumpSortKey = NonNullable<PumpListQuery['sort']>;
export type PumpRevisionQuery = QueryOf<'getPump'>;
export type PipeSizesQuery = QueryOf<'listPipeSizes'>;
export type FittingsQuery = QueryOf<'listFittings'>;
export type AuditEventsQuery = QueryOf<'listAuditEvents'>;

// Reports and the company profile.
export type CompanyProfile = Schemas['CompanyProfile'];
export type CompanyProfileInput = Schemas['CompanyProfileInput'];
export type CompanyLogo = Schemas['CompanyLogo'];
export type ReportPaper = Schemas['ReportPaper'];
export type ReportRequest = Schemas['ReportRequest'];
export type ReportSummary = Schemas['ReportSummary'];
export type ReportList = Schemas['ReportList'];

// Sending proposals to clients.
export type ProjectClient = Schemas['ProjectClient'];
export type ProjectClientInput = Schemas['ProjectClientInput'];
export type ProposalMailRequest = Schemas['ProposalMailRequest'];
export type ProposalMail = Schemas['ProposalMail'];
export type ProposalMailList = Schemas['ProposalMailList'];
export type ClientLinkRequest = Schemas['ClientLinkRequest'];
export type ClientLinkState = Schemas['ClientLinkState'];
export type ClientLink = Schemas['ClientLink'];
export type CreatedClientLink = Schemas['CreatedClientLink'];
export type ClientLinkList = Schemas['ClientLinkList'];
