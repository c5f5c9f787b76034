import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { MissesModule } from '../misses/misses.module.js';
import { Note } from './models/note.model.js';
import { NotesController } from './notes.controller.js';
import { NotesService } from './notes.service.js';

@Module({
  imports: [SequelizeModule.forFeature([Note]), MissesModule],
  controllers: [NotesController],
  providers: [NotesService],
  exports: [NotesService],
})
export class NotesModule {}
