import { Option, type Command } from 'commander';
import { limitOption, type CliIo } from './common.js';
import type { RefitOptions } from './refitAction.js';

const collect = (value: string, previous: string[]): string[] => [...previous, value];


export function registerRefitCommand(program: Command, io: CliIo, setExitCode: (code: number) => void): void {
  program
    .command('refit')
    .description('rebuild an ANOVA/ANCOVA table from raw data (CSV, TSV, XLSX), compare it with the reported one and name the slip that reproduces it')
    .argument('<data>', 'the raw data file')
    .option('-m, --model <formula>', 'model formula, e.g. "mood ~ route * pace + loneliness"')
    .addOption(new Option('-t, --type <type>', 'sums of squares type (default 3)').choices(['1', '2', '3']))
    .addOption(new Option('--coding <coding>', 'factor coding for type III (default sum)').choices(['sum', 'treatment']))
    .option('--factor <column>', 'treat a numeric column as a factor (repeatable)', collect, [])
    .option('--covariate <column>', 'treat a column as a numeric covariate (repeatable)', collect, [])
    .option('--missing <rule>', 'missing-value codes of a column: "mood=99", "anxiety=6-8", "age=>=200", "group=8,9" (repeatable)', collect, [])
    .option('--reported <file>', 'what the manuscript reports: a table file (CSV, Markdown) or the manuscript (PDF, DOCX, HTML, XML, TXT, MD)')
    .option('--map <pair>', 'name a reported row for a model term: "Teaching method=method" (repeatable)', collect, [])
    .option('--spec <file>', 'analysis description (JSON); command-line options override it')
    .addOption(limitOption('change a limit on reading the --reported manuscript (maxSecondsPerDocument: its time budget, 120 s)'))
    .option('--coefficients', 'also print the regression coefficients of the design columns, with SE, t, p and CI')
    .option('--means <term>', 'estimated marginal (covariate-adjusted) means of a factor or a combination: "group", "group:time" (repeatable)', collect, [])
    .option('--pairwise', 'pairwise comparisons of the --means (adjusted as --adjust says, Tukey by default)')
    .addOption(new Option('--adjust <method>', 'adjustment of the pairwise comparisons (implies --pairwise; default tukey, Tukey-Kramer when cells are unequal)').choices(['tukey', 'bonferroni', 'holm', 'sidak', 'scheffe', 'none']))
    .addOption(new Option('--weights <weights>', 'how marginal means weight the levels of the factors they average over: equally (default) or in proportion to the analysed rows').choices(['equal', 'proportional']))
    .option('--within <factor>', 'simple comparisons: compare the --means within each level of this factor, e.g. --means group --within site (implies --pairwise)')
    .option('--contrast <weights>', 'a planned contrast of marginal means, weights in level order: "group=-0.5,-0.5,1" (repeatable)', collect, [])
    .option('--at <value>', 'hold a covariate at this value for --means and --contrast instead of its mean: "baseline=30" (repeatable)', collect, [])
    .addOption(new Option('--levene <center>', "Levene's test of equal variances across the cells, centred on each cell's median (Brown-Forsythe) or mean").choices(['median', 'mean']))
    .option('--levels <levels>', 'declare a factor\'s levels in the order wanted: "group=control,training,waitlist" (repeatable; other values are then errors)', collect, [])
    .option('--labels <labels>', 'labels for a factor\'s level codes, shown in every output: "group=1:control,2:training,3:waitlist" (repeatable)', collect, [])
    .option('--name <name>', 'a name shown for a variable in the tables, which reported rows may use too: "route=Walking route" (repeatable)', collect, [])
    .option('--range <range>', 'values a numeric column may take; cells outside are reported with their rows: "mood=1..5" (repeatable)', collect, [])
    .addOption(new Option('--term-order <order>', 'order of the terms, which type I sums of squares follow: by degree (main effects and covariates, then two-way interactions, ...; default) or as written').choices(['degree', 'written']))
    .option('--center', 'centre covariates at their means where they interact with a factor, so type III tests of the factor are at the mean, not at 0')
    .option('--slopes', 'test the homogeneity of regression slopes (covariate × factor interactions); on by default in the text report of an ANCOVA')
    .option('--no-slopes', 'leave the homogeneity-of-slopes test out')
    .option('--max-columns <n>', 'most design columns fitted (default 1000): stops a factor with thousands of levels, usually an identifier, from running for hours')
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json', 'md', 'html', 'docx']).default('text'))
    .option('-o, --output <file>', 'write the output to a file (required for docx)')
    .action(async (dataFile: string, options: RefitOptions) => {
      const { runRefitCommand } = await import('./refitAction.js');
      setExitCode(await runRefitCommand(dataFile, options, io));
    });
}

