import { VueQueryPlugin } from '@tanstack/vue-query'
import { createPinia } from 'pinia'
import { createApp } from 'vue'
import App from './App.vue'
import { queryClient } from './api/query-client'
import { i18n } from './i18n'
import { activeDescendantFix } from './plugins/active-descendant'
import { router } from './router'
import 'element-plus/theme-chalk/base.css'
// The resolver styles only the components a template names; these are called from code (ElMessage,
// ElMessageBox), so their styles are loaded here, once for every view.
import 'element-plus/es/components/message/style/css'
import 'element-plus/es/components/message-box/style/css'
import './assets/theme.css'

createApp(App)
  .use(createPinia())
  .use(i18n)
  .use(router)
  .use(VueQueryPlugin, { queryClient })
  .use(activeDescendantFix)
  .mount('#app')
