/** Classes of a desk's tab trigger (reka-ui TabsTrigger): the control desk's and the team room's tabs look alike. */
export const DESK_TAB = '-mb-px border-b-2 border-transparent px-3 py-2 text-sm font-medium text-abyss-600 hover:text-abyss-900 '
  + 'data-[state=active]:border-tide-600 data-[state=active]:text-abyss-900 dark:text-abyss-300 dark:hover:text-white '
  + 'dark:data-[state=active]:border-tide-400 dark:data-[state=active]:text-white'
