import { Box, Text, useApp } from 'ink';
import { useMemo, useReducer, useState } from 'react';
import type { Settings } from '../store/settings';
import { ChannelsPane } from './channels/channels-pane';
import { Line } from './common/line';
import { type Controller, useController } from './controller/use-controller';
import { useKeys } from './controller/use-keys';
import { FindingsPane } from './findings/findings-pane';
import { HelpOverlay, helpScrollCount } from './help/help-overlay';
import { useAnalysis, useProbe } from './hooks/use-analysis';
import { useAutosave } from './hooks/use-autosave';
import { type ScreenSize, useScreenSize } from './hooks/use-screen-size';
import { activeScope, type KeyContext, KEYMAP, whyDisabled } from './keymap';
import { computeLayout, MIN_COLUMNS, MIN_ROWS } from './layout';
import { ProbePane } from './probe/probe-pane';
import { PromptLine } from './prompt/prompt-line';
import { QuestionLine } from './prompt/question-line';
import type { Services } from './services';
import { SettingsOverlay } from './settings/settings-overlay';
import { appReducer, isModified, selectedField } from './state/app-reducer';
import type { AppState } from './state/app-state';
import { paneFields } from './state/fields';
import { matchTargets } from './state/target-match';
import { HintBar } from './status/hint-bar';
import { TitleBar } from './status/title-bar';
import { StringPane } from './string/string-pane';
import { sweepPlotWidth, SweepPane } from './sweep/sweep-pane';
import { TargetsPane } from './targets/targets-pane';
import { makeTheme } from './theme';

/** Props of App. */
export interface AppProps {
  /** The state to start from (design loaded, maybe a draft question already asked). */
  initial: AppState;
  services: Services;
  /** NO_COLOR was requested. */
  noColor: boolean;
  /** Called once with the exit code when the user leaves. */
  onExit: (code: number) => void;
  /** Fixed terminal size (tests); otherwise the terminal's, following resizes. */
  size?: ScreenSize;
  /** Receives the draft flusher so a hang-up can save pending work. */
  onFlushReady?: (flush: () => void) => void;
}

/** The interactive screen. */
export function App({ initial, services, noColor, onExit, size: fixedSize, onFlushReady }: AppProps) {
  const [state, dispatch] = useReducer(appReducer, initial);
  const [settings, setSettings] = useState<Settings>(() => services.settings.get());
  const { exit } = useApp();
  const size = useScreenSize(fixedSize);
  const theme = useMemo(() => makeTheme({ ascii: settings.ascii, color: !noColor }), [settings.ascii, noColor]);
  const computed = useAnalysis(state.design);
  const probe = useProbe(computed, state.probe.x, state.probe.direction);
  const layout = computeLayout(size.columns, size.rows, state.design.channels.length, state.pane === 'targets' || state.pane === 'findings');
  const autosave = useAutosave({ design: state.design, isModified: isModified(state), file: state.file, drafts: services.drafts, now: services.now });
  onFlushReady?.(autosave.flush);
  const ctx: KeyContext = { state, hasPlanner: !!services.plan, hasSpread: !!services.spread, hasExport: !!services.exportDesign };
  const plotWidth = layout ? sweepPlotWidth(state.design, layout.rightWidth) : 40;
  const footerRows = state.prompt?.error ? 2 : 1;
  const overlayHeight = layout ? layout.rows - 2 - footerRows : 1;
  const controller: Controller = useController({
    state, dispatch, services, settings, setSettings, plotWidth,
    // Only read while the help overlay is open: wrapping every help line on each keystroke is a good part of a frame.
    helpLength: layout && state.overlay === 'help' ? helpScrollCount(ctx, theme.isAscii, layout.columns, overlayHeight) : 1,
    helpPage: Math.max(1, overlayHeight - 2),
    flushDraft: autosave.flush,
    exit: (code) => {
      onExit(code);
      exit();
    },
  });
  useKeys({
    ctx, controller, isActive: !!layout, ascii: theme.isAscii,
    onType: (text) => dispatch({ type: 'prompt-type', text }),
    onRefused: (text) => dispatch({ type: 'message', message: { text, tone: 'error' } }),
  });
  if (!layout) {
    return (
      <Box flexDirection="column">
        <Text {...theme.error()}>Enlarge the window: tapline needs at least {MIN_COLUMNS}x{MIN_ROWS}.</Text>
        <Text>This one is {size.columns}x{size.rows}. q quits.</Text>
      </Box>
    );
  }
  const { columns: W } = layout;
  const field = selectedField(state);
  const scope = activeScope(state);
  const stringFields = paneFields(state.design, 'string');
  const matches = computed.ok ? matchTargets(state.design, computed.analysis.channels) : {};
  const selChannel = state.pane === 'channels' ? field?.channel : undefined;
  const planBinding = KEYMAP.find((b) => b.action === 'plan');
  const footer = state.question ? <QuestionLine question={state.question} now={services.now()} width={W} theme={theme} />
    : state.prompt ? <PromptLine prompt={state.prompt} width={W} theme={theme} />
    : <Line width={W} segs={[{ text: state.message?.text ?? '', style: state.message?.tone === 'error' ? theme.error() : state.message?.tone === 'ok' ? theme.ok() : theme.muted() }]} />;
  let body;
  if (state.overlay === 'help') {
    body = <HelpOverlay ctx={ctx} top={state.overlayIndex} width={W} height={overlayHeight} theme={theme} />;
  } else if (state.overlay === 'settings') {
    body = <SettingsOverlay settings={settings} selected={state.overlayIndex} path={services.settings.path} width={W} height={overlayHeight} theme={theme} />;
  } else if (!computed.ok) {
    body = <Box height={layout.rows - 2 - footerRows}><Text {...theme.error()}>{computed.message}</Text></Box>;
  } else {
    const a = computed.analysis;
    const lowerH = layout.lowerHeight - (footerRows - 1);
    body = (
      <Box flexDirection="column">
        <ChannelsPane design={state.design} channels={a.channels} targets={matches} selectedId={state.pane === 'channels' ? field?.id : undefined}
          selectedChannel={selChannel} isFocused={state.pane === 'channels'} width={W} height={layout.channelsHeight} isWide={layout.isWide} theme={theme} />
        <Box flexDirection="row" height={layout.middleHeight - (footerRows - 1)}>
          <StringPane design={state.design} fields={stringFields} selectedId={state.pane === 'string' ? field?.id : undefined} probe={probe}
            isFocused={state.pane === 'string'} width={layout.leftWidth} height={layout.middleHeight - (footerRows - 1)} theme={theme} />
          <Box width={1} />
          <Box flexDirection="column" width={layout.rightWidth}>
            {layout.sweepHeight > 0 && <SweepPane design={state.design} analysis={a} probeX={state.probe.x} selectedChannel={selChannel} width={layout.rightWidth} height={layout.sweepHeight} theme={theme} />}
            <ProbePane design={state.design} probe={probe} width={layout.rightWidth} height={layout.probeHeight} theme={theme} />
            {state.pane === 'targets'
              ? <TargetsPane design={state.design} fields={paneFields(state.design, 'targets')} channels={a.channels} matches={matches}
                  selectedId={field?.id} isFocused planDisabled={planBinding ? whyDisabled(planBinding, ctx) : null} width={layout.rightWidth} height={lowerH} theme={theme} />
              : <FindingsPane design={state.design} findings={a.findings} spread={state.spread} selected={state.selected.findings}
                  isFocused={state.pane === 'findings'} width={layout.rightWidth} height={lowerH} theme={theme} />}
          </Box>
        </Box>
      </Box>
    );
  }
  return (
    <Box flexDirection="column" width={W} height={layout.rows}>
      <TitleBar state={state} width={W} theme={theme} />
      {body}
      {footer}
      <HintBar scope={scope} ctx={ctx} width={W} theme={theme} />
    </Box>
  );
}
